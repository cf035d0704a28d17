import { describe, expect, it } from 'vitest';
import { formatDate, formatDateTime, formatSignatureTime, formatUtcDateTime, isValidTimeZone } from '../../shared/format/dates';

// Zone offsets from the IANA time zone database as the runtime's ICU ships it:
// Europe/Berlin is UTC+1 in winter (CET) and UTC+2 in summer (CEST).
describe('one date and time format', () => {
  it('when a calendar date is shown, then it reads "2 Dec 2026" and no zone shifts it', () => {
    expect(formatDate('2026-12-02')).toBe('2 Dec 2026');
    expect(formatDate('2026-01-31', 'Pacific/Auckland')).toBe('31 Jan 2026');
    expect(formatDate(null)).toBe('—');
  });

  it('when a moment is shown, then it reads in the organisation zone with the zone named', () => {
    expect(formatDateTime('2026-12-02T13:05:00.000Z')).toBe('2 Dec 2026, 13:05 UTC');
    expect(formatDateTime('2026-12-02T13:05:00.000Z', 'Europe/Berlin')).toBe('2 Dec 2026, 14:05 CET');
    expect(formatDateTime('2026-07-01T23:30:00.000Z', 'Europe/Berlin')).toBe('2 Jul 2026, 01:30 CEST');
  });

  it('when a signature is shown, then it states UTC, with the local time beside it off UTC', () => {
    expect(formatUtcDateTime('2026-12-02T13:05:00.000Z')).toBe('2 Dec 2026, 13:05 UTC');
    expect(formatSignatureTime('2026-12-02T13:05:00.000Z', 'UTC')).toBe('2 Dec 2026, 13:05 UTC');
    expect(formatSignatureTime('2026-12-02T13:05:00.000Z', 'Europe/Berlin')).toBe('2 Dec 2026, 13:05 UTC (2 Dec 2026, 14:05 CET)');
  });

  it('when a zone name is checked, then only IANA names pass', () => {
    expect(isValidTimeZone('Europe/London')).toBe(true);
    expect(isValidTimeZone('Mars/Olympus')).toBe(false);
  });
});
