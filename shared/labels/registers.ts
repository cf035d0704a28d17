// Register flags in words: certificates, near-vision exams, calibration, and the
// state of an item of equipment as a user needs it on the day.
import type { CalibrationStatus, CertificateStatus, EquipmentUseStatus, VisionStatus } from '../registers/flags';

export const CERTIFICATE_STATUS_LABELS: Record<CertificateStatus, string> = {
  expired: 'Expired',
  'expires-30': 'Expires within 30 days',
  'expires-60': 'Expires within 60 days',
  valid: 'Valid',
};

export const VISION_STATUS_LABELS: Record<VisionStatus, string> = {
  missing: 'No near-vision exam on record',
  overdue: 'Near-vision exam overdue',
  'due-soon': 'Near-vision exam due soon',
  ok: 'Near-vision exam current',
};

/** "Calibration current", not "in calibration", which reads as "away at the calibration lab". */
export const CALIBRATION_STATUS_LABELS: Record<CalibrationStatus, string> = {
  none: 'No calibration record',
  overdue: 'Out of calibration',
  'due-soon': 'Calibration due soon',
  ok: 'Calibration current',
};

export const EQUIPMENT_USE_STATUS_LABELS: Record<EquipmentUseStatus, string> = {
  in_service: 'In service',
  out_of_calibration: 'Out of calibration',
  quarantined: 'Quarantined',
  retired: 'Retired',
};
