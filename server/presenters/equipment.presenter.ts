import type { Equipment, ReferenceNotch } from '../models';
import type { EquipmentView, NotchView } from '../../shared/schemas/equipment';
import { calibrationFlag, equipmentUseStatus } from '../../shared/registers/flags';

const num = (value: string | number | null): number | null => (value === null ? null : Number(value));

export function presentNotch(notch: ReferenceNotch): NotchView {
  return {
    id: notch.id,
    label: notch.label,
    orientation: notch.orientation as NotchView['orientation'],
    angleDeg: num(notch.angleDeg),
    depthMm: Number(notch.depthMm),
    lengthMm: Number(notch.lengthMm),
    edgeDistanceMm: num(notch.edgeDistanceMm),
  };
}

export function presentEquipment(item: Equipment, now: Date): EquipmentView {
  return {
    id: item.id,
    kind: item.kind as EquipmentView['kind'],
    description: item.description,
    model: item.model,
    serialNumber: item.serialNumber,
    calibratedOn: item.calibratedOn,
    calibrationDueOn: item.calibrationDueOn,
    status: item.status as EquipmentView['status'],
    conductivityIacs: num(item.conductivityIacs),
    material: item.material,
    notes: item.notes,
    notches: [...(item.notches ?? [])].sort((a, b) => a.position - b.position).map(presentNotch),
    version: item.version,
    calibration: calibrationFlag(item.calibrationDueOn, now),
    useStatus: equipmentUseStatus(item.status, item.calibrationDueOn, now),
  };
}
