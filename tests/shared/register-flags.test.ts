import { describe, expect, it } from 'vitest';
import { CALIBRATION_STATUS_LABELS, EQUIPMENT_USE_STATUS_LABELS, calibrationFlag, certificateFlag, equipmentUseStatus, visionFlag } from '../../shared/registers/flags';

const at = (day: string) => new Date(`${day}T15:30:00Z`);

describe('register flags', () => {
  // Warning days 60 and 30 are Whorl product defaults (no published source); a certificate is
  // valid through its expiry day, as the checklist engine's personnel rule reads it.
  it.each([
    ['2027-01-01', 'valid', 61],
    ['2027-01-02', 'expires-60', 60],
    ['2027-01-31', 'expires-60', 31],
    ['2027-02-01', 'expires-30', 30],
    ['2027-03-03', 'expires-30', 0],
    ['2027-03-04', 'expired', -1],
  ])('when today is %s and the certificate expires 2027-03-03, then it is %s with %i days left', (today, status, daysLeft) => {
    expect(certificateFlag('2027-03-03', at(today))).toEqual({ status, daysLeft });
  });

  // ISO 9712: near-vision acuity checked at least annually (policy nearVisionExamMonths, default 12).
  // Calendar months, clamped at the month's end (common practice, no single source): 29 Feb + 12 months = 28 Feb.
  it.each([
    ['2026-05-10', '2027-05-10', '2027-04-09', 'ok'],
    ['2026-05-10', '2027-05-10', '2027-04-10', 'due-soon'],
    ['2026-05-10', '2027-05-10', '2027-05-10', 'due-soon'],
    ['2026-05-10', '2027-05-10', '2027-05-11', 'overdue'],
    ['2024-02-29', '2025-02-28', '2025-03-01', 'overdue'],
    ['2024-02-29', '2025-02-28', '2025-02-28', 'due-soon'],
  ])('when the exam was on %s, then it counts until %s; on %s it is %s', (exam, dueOn, today, status) => {
    expect(visionFlag(exam, at(today), 12)).toMatchObject({ status, dueOn });
  });

  it('when no exam is on record, then the vision flag says so', () => {
    expect(visionFlag(null, at('2026-12-01'), 12)).toEqual({ status: 'missing', dueOn: null, daysLeft: null });
  });

  it('when a calibration is due today, then its calibration is still current (due soon); the day after, overdue', () => {
    expect(calibrationFlag('2026-12-01', at('2026-12-01'))).toEqual({ status: 'due-soon', daysLeft: 0 });
    expect(calibrationFlag('2026-12-01', at('2026-12-02'))).toEqual({ status: 'overdue', daysLeft: -1 });
    expect(calibrationFlag('2027-01-01', at('2026-12-01'))).toEqual({ status: 'ok', daysLeft: 31 });
    expect(calibrationFlag(null, at('2026-12-01'))).toEqual({ status: 'none', daysLeft: null });
  });
});

describe('equipment status on the day', () => {
  // A calibration is valid through its due day (common practice, no single source); the day after, the item is out of calibration.
  it.each([
    ['in_service', '2026-12-01', '2026-11-30', 'in_service'],
    ['in_service', '2026-12-01', '2026-12-01', 'in_service'],
    ['in_service', '2026-12-01', '2026-12-02', 'out_of_calibration'],
    ['in_service', '2026-11-20', '2026-12-02', 'out_of_calibration'],
    ['in_service', null, '2026-12-02', 'in_service'],
    ['quarantined', '2026-11-20', '2026-12-02', 'quarantined'],
    ['retired', '2026-11-20', '2026-12-02', 'retired'],
  ] as const)('when stored %s, due %s and today is %s, then it is %s', (stored, dueOn, today, expected) => {
    expect(equipmentUseStatus(stored, dueOn, at(today))).toBe(expected);
  });

  it('when an item in service is 12 days past its due date, then it reads "Out of calibration", never "In service"; a current one reads "Calibration current"', () => {
    const status = equipmentUseStatus('in_service', '2026-11-20', at('2026-12-02'));
    expect(EQUIPMENT_USE_STATUS_LABELS[status]).toBe('Out of calibration');
    expect(CALIBRATION_STATUS_LABELS[calibrationFlag('2026-11-20', at('2026-12-02')).status]).toBe('Out of calibration');
    expect(CALIBRATION_STATUS_LABELS.ok).toBe('Calibration current');
  });
});
