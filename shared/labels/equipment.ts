// Equipment kinds and the stored status an administrator sets. Whether an item
// may be used on a given day also depends on its calibration (registers.ts).
import type { EQUIPMENT_KIND_VALUES, EQUIPMENT_STATUSES } from '../schemas/equipment';

export const EQUIPMENT_KIND_LABELS: Record<(typeof EQUIPMENT_KIND_VALUES)[number], string> = {
  instrument: 'Instrument',
  probe: 'Probe',
  'reference-standard': 'Reference standard',
};

export const EQUIPMENT_STATUS_LABELS: Record<(typeof EQUIPMENT_STATUSES)[number], string> = {
  in_service: 'In service',
  quarantined: 'Quarantined',
  retired: 'Retired',
};
