// Register flags, computed the same way on the server (lists, reminders, filters)
// and in the client: a certificate is valid through its expiry day; a near-vision
// exam is good for policy nearVisionExamMonths (default 12) calendar months, and
// the engine's `personnel` rule uses the same day arithmetic (utcDayPlusMonths).
import { isoDay, utcDay, utcDayPlusMonths } from '../domain/checklist/registers';

/** Warn this many days ahead of a certificate expiry (Whorl product default, no published source). */
export const CERTIFICATE_WARNING_DAYS = [60, 30] as const;
/** Warn this many days before a near-vision exam lapses (Whorl product default). */
export const VISION_WARNING_DAYS = 30;
/** Calibration due soon within this many days (Whorl product default). */
export const CALIBRATION_WARNING_DAYS = 30;

export type CertificateStatus = 'expired' | 'expires-30' | 'expires-60' | 'valid';
export type VisionStatus = 'missing' | 'overdue' | 'due-soon' | 'ok';
export type CalibrationStatus = 'none' | 'overdue' | 'due-soon' | 'ok';

export interface CertificateFlag {
  status: CertificateStatus;
  /** Days from today to the expiry day (0 on the expiry day itself, negative once expired). */
  daysLeft: number;
}

export interface VisionFlag {
  status: VisionStatus;
  /** Last day on which the exam still counts; null without an exam. */
  dueOn: string | null;
  daysLeft: number | null;
}

export interface CalibrationFlag {
  status: CalibrationStatus;
  daysLeft: number | null;
}

const toDate = (value: string | Date) => (value instanceof Date ? value : new Date(`${value}T00:00:00Z`));

export function certificateFlag(expiresOn: string | Date, now: Date): CertificateFlag {
  const daysLeft = utcDay(toDate(expiresOn)) - utcDay(now);
  const [sixty, thirty] = CERTIFICATE_WARNING_DAYS;
  const status: CertificateStatus = daysLeft < 0 ? 'expired' : daysLeft <= thirty ? 'expires-30' : daysLeft <= sixty ? 'expires-60' : 'valid';
  return { status, daysLeft };
}

export function visionFlag(examOn: string | Date | null, now: Date, months: number): VisionFlag {
  if (!examOn) return { status: 'missing', dueOn: null, daysLeft: null };
  const dueDay = utcDayPlusMonths(toDate(examOn), months);
  const daysLeft = dueDay - utcDay(now);
  const status: VisionStatus = daysLeft < 0 ? 'overdue' : daysLeft <= VISION_WARNING_DAYS ? 'due-soon' : 'ok';
  return { status, dueOn: isoDay(new Date(dueDay * 86_400_000)), daysLeft };
}

export function calibrationFlag(dueOn: string | Date | null, now: Date): CalibrationFlag {
  if (!dueOn) return { status: 'none', daysLeft: null };
  const daysLeft = utcDay(toDate(dueOn)) - utcDay(now);
  const status: CalibrationStatus = daysLeft < 0 ? 'overdue' : daysLeft <= CALIBRATION_WARNING_DAYS ? 'due-soon' : 'ok';
  return { status, daysLeft };
}

/**
 * What an item of equipment is on a day: the stored status, except that an item
 * in service past its calibration due date is out of calibration, whatever was
 * stored. The due date itself is still a day of valid calibration.
 */
export type EquipmentUseStatus = 'in_service' | 'out_of_calibration' | 'quarantined' | 'retired';

export function equipmentUseStatus(storedStatus: string, calibrationDueOn: string | Date | null, now: Date): EquipmentUseStatus {
  if (storedStatus === 'quarantined' || storedStatus === 'retired') return storedStatus;
  return calibrationFlag(calibrationDueOn, now).status === 'overdue' ? 'out_of_calibration' : 'in_service';
}

export { CALIBRATION_STATUS_LABELS, CERTIFICATE_STATUS_LABELS, EQUIPMENT_USE_STATUS_LABELS, VISION_STATUS_LABELS } from '../labels/registers';
