// Inspections performed with a technique revision: the register's input and views.
import { z } from 'zod';
import { IsoDateSchema, ListQueryBaseSchema } from './common';

export const INSPECTION_RESULTS = ['accept', 'reject', 'indication_recorded'] as const;
export type InspectionResult = (typeof INSPECTION_RESULTS)[number];
export const INSPECTION_RESULT_LABELS: Record<InspectionResult, string> = {
  accept: 'Accept',
  reject: 'Reject',
  indication_recorded: 'Indication recorded',
};

const text = (label: string, max: number) =>
  z.string({ error: `${label} is required` }).trim().min(1, `enter the ${label}`).max(max, `${label} is at most ${max} characters`);
const equipmentRef = z.number().int().positive().nullable().default(null);

export const InspectionFieldsSchema = z
  .object({
    techniqueRevisionId: z.number({ error: 'choose the technique revision the work was done to' }).int().positive(),
    performedOn: IsoDateSchema,
    partNumber: text('part number', 80),
    serialNumber: text('serial number', 80),
    workOrder: text('work order', 60),
    customer: text('customer', 120),
    inspectorId: z.number({ error: 'choose the inspector' }).int().positive(),
    result: z.enum(INSPECTION_RESULTS, { error: `result must be one of ${INSPECTION_RESULTS.join(', ')}` }),
    instrumentId: equipmentRef,
    probeId: equipmentRef,
    referenceStandardId: equipmentRef,
    notes: z.string().trim().max(2000, 'notes are at most 2000 characters').nullable().default(null),
  })
  .strict();
export type InspectionInput = z.infer<typeof InspectionFieldsSchema>;

export interface InspectionEquipmentRef {
  id: number;
  kind: string;
  serialNumber: string;
  description: string;
}

export interface InspectionView {
  id: number;
  technique: { id: number; code: string };
  revision: { id: number; revision: string };
  performedOn: string;
  partNumber: string;
  serialNumber: string;
  workOrder: string;
  customer: string;
  inspector: { id: number; name: string };
  result: InspectionResult;
  instrument: InspectionEquipmentRef | null;
  probe: InspectionEquipmentRef | null;
  referenceStandard: InspectionEquipmentRef | null;
  notes: string | null;
  version: number;
  createdAt: string;
}

export const InspectionListQuerySchema = ListQueryBaseSchema.extend({
  techniqueId: z.coerce.number().int().positive().optional(),
  revisionId: z.coerce.number().int().positive().optional(),
  equipmentId: z.coerce.number().int().positive().optional(),
  result: z.enum(INSPECTION_RESULTS).optional(),
  from: IsoDateSchema.optional(),
  to: IsoDateSchema.optional(),
}).strict();
