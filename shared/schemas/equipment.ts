import { z } from 'zod';
import { IsoDateSchema, ListQueryBaseSchema } from './common';
import { FLAW_ORIENTATIONS } from './technique';
import type { CalibrationFlag, EquipmentUseStatus } from '../registers/flags';

/** The same kinds the checklist engine's `equipment` rule knows. */
export const EQUIPMENT_KIND_VALUES = ['instrument', 'probe', 'reference-standard'] as const;
export { EQUIPMENT_KIND_LABELS, EQUIPMENT_STATUS_LABELS } from '../labels/equipment';
export const EQUIPMENT_STATUSES = ['in_service', 'quarantined', 'retired'] as const;

const positiveMm = (label: string) =>
  z.number({ error: `${label} must be a number in mm` }).positive(`${label} must be greater than 0 mm`).max(10_000, `${label} is at most 10 000 mm`);

export const NotchInputSchema = z
  .object({
    label: z.string().trim().max(60).nullable().default(null),
    orientation: z.enum(FLAW_ORIENTATIONS, { error: `orientation must be one of ${FLAW_ORIENTATIONS.join(', ')}` }),
    angleDeg: z.number().min(-180).max(180).nullable().default(null),
    depthMm: positiveMm('notch depth'),
    lengthMm: positiveMm('notch length'),
    edgeDistanceMm: z.number().min(0, 'edge distance must be 0 mm or more').max(10_000).nullable().default(null),
  })
  .strict();

const equipmentFields = {
  kind: z.enum(EQUIPMENT_KIND_VALUES, { error: `kind must be one of ${EQUIPMENT_KIND_VALUES.join(', ')}` }),
  description: z.string().trim().min(1, 'describe the item').max(200),
  model: z.string().trim().max(100).nullable().default(null),
  serialNumber: z.string().trim().min(1, 'enter the serial number').max(100),
  calibratedOn: IsoDateSchema.nullable().default(null),
  calibrationDueOn: IsoDateSchema.nullable().default(null),
  status: z.enum(EQUIPMENT_STATUSES).default('in_service'),
  conductivityIacs: z.number().positive('conductivity must be above 0 %IACS').max(120, 'conductivity is at most 120 %IACS').nullable().default(null),
  material: z.string().trim().max(100).nullable().default(null),
  notes: z.string().trim().max(2000).nullable().default(null),
  notches: z.array(NotchInputSchema).max(50, 'at most 50 notches').default([]),
};

const dueAfterCalibration = (value: { calibratedOn?: string | null; calibrationDueOn?: string | null }) =>
  !value.calibratedOn || !value.calibrationDueOn || value.calibrationDueOn > value.calibratedOn;
const notchesOnlyOnStandards = (value: { kind?: string; notches?: unknown[] }) =>
  !value.kind || value.kind === 'reference-standard' || !value.notches?.length;

export const EquipmentCreateSchema = z
  .object(equipmentFields)
  .strict()
  .refine(dueAfterCalibration, { message: 'the due date must be after the calibration date', path: ['calibrationDueOn'] })
  .refine(notchesOnlyOnStandards, { message: 'only a reference standard has notches', path: ['notches'] });

export const EquipmentUpdateSchema = z
  .object({
    version: z.number().int().min(0),
    description: equipmentFields.description.optional(),
    model: z.string().trim().max(100).nullable().optional(),
    serialNumber: equipmentFields.serialNumber.optional(),
    calibratedOn: IsoDateSchema.nullable().optional(),
    calibrationDueOn: IsoDateSchema.nullable().optional(),
    status: z.enum(EQUIPMENT_STATUSES).optional(),
    conductivityIacs: z.number().positive().max(120).nullable().optional(),
    material: z.string().trim().max(100).nullable().optional(),
    notes: z.string().trim().max(2000).nullable().optional(),
    notches: z.array(NotchInputSchema).max(50).optional(),
  })
  .strict()
  .refine(dueAfterCalibration, { message: 'the due date must be after the calibration date', path: ['calibrationDueOn'] });

export const EquipmentListQuerySchema = ListQueryBaseSchema.extend({
  kind: z.enum(EQUIPMENT_KIND_VALUES).optional(),
  status: z.enum(EQUIPMENT_STATUSES).optional(),
  calibration: z.enum(['overdue', 'due-soon', 'none']).optional(),
}).strict();

/** Which equipment and which people a technique uses (replaces both lists). */
export const TechniqueLinksSchema = z
  .object({
    equipmentIds: z.array(z.number().int().positive()).max(50),
    performerIds: z.array(z.number().int().positive()).max(200),
  })
  .strict();

export type NotchInput = z.infer<typeof NotchInputSchema>;
export type EquipmentCreateInput = z.infer<typeof EquipmentCreateSchema>;
export type EquipmentUpdateInput = z.infer<typeof EquipmentUpdateSchema>;
export type EquipmentListQuery = z.infer<typeof EquipmentListQuerySchema>;
export type TechniqueLinksInput = z.infer<typeof TechniqueLinksSchema>;

export interface NotchView extends NotchInput {
  id: number;
}

export interface EquipmentView {
  id: number;
  kind: (typeof EQUIPMENT_KIND_VALUES)[number];
  description: string;
  model: string | null;
  serialNumber: string;
  calibratedOn: string | null;
  calibrationDueOn: string | null;
  status: (typeof EQUIPMENT_STATUSES)[number];
  conductivityIacs: number | null;
  material: string | null;
  notes: string | null;
  notches: NotchView[];
  version: number;
  calibration: CalibrationFlag;
  /** The stored status, or out of calibration when an item in service is past its due date. */
  useStatus: EquipmentUseStatus;
}

export interface TechniqueLinksView {
  techniqueId: number;
  equipment: EquipmentView[];
  performers: { id: number; displayName: string }[];
}
