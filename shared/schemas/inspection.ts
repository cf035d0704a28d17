// Inspections performed with a technique revision: the register's input and views.
import { z } from 'zod';
import { IsoDateSchema, ListQueryBaseSchema, isWellFormedText, ILL_FORMED_TEXT_MESSAGE } from './common';

export const INSPECTION_RESULTS = ['accept', 'reject', 'indication_recorded'] as const;
export type InspectionResult = (typeof INSPECTION_RESULTS)[number];
export { INSPECTION_RESULT_LABELS } from '../labels/inspections';

const text = (label: string, max: number) =>
  z.string({ error: `${label} is required` }).trim().min(1, `enter the ${label}`).max(max, `${label} is at most ${max} characters`)
    .refine(isWellFormedText, ILL_FORMED_TEXT_MESSAGE);
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
  /** Who recorded it: a technician may correct only their own rows. */
  createdById: number;
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

/** A correction sends the whole record back with the version it was read at (409 when stale). */
export const InspectionUpdateSchema = InspectionFieldsSchema.extend({
  version: z.number({ error: 'send the version you read' }).int().min(0),
}).strict();
export type InspectionUpdateInput = z.infer<typeof InspectionUpdateSchema>;
export type InspectionListQuery = z.infer<typeof InspectionListQuerySchema>;

/** What the form's selects offer: revisions that were approved (in force or superseded), people and equipment. */
export interface InspectionOptionsView {
  revisions: { id: number; techniqueId: number; techniqueCode: string; techniqueTitle: string; revision: string; state: string; approvedOn: string }[];
  inspectors: { id: number; name: string; email: string }[];
  equipment: (InspectionEquipmentRef & { status: string; calibrationDueOn: string | null })[];
}

// ---- CSV import -------------------------------------------------------------

export const INSPECTION_IMPORT_MAX_BYTES = 2 * 1024 * 1024;
export const INSPECTION_IMPORT_MAX_ROWS = 5000;

/** The import file's columns, in the order an exported template lists them. Headers match case-insensitively, ignoring spaces, "-" and "_". */
export const INSPECTION_IMPORT_COLUMNS = [
  { header: 'date', required: true, description: 'The day the inspection was performed, as 2026-11-30 (not before the revision’s approval, not in the future).' },
  { header: 'technique code', required: true, description: 'The technique’s code, e.g. TAC-ET-011.' },
  { header: 'revision', required: true, description: 'The revision letter the work was done to; it must have been approved.' },
  { header: 'part number', required: true, description: 'Up to 80 characters.' },
  { header: 'serial number', required: true, description: 'Up to 80 characters.' },
  { header: 'work order', required: true, description: 'Up to 60 characters.' },
  { header: 'customer', required: true, description: 'Up to 120 characters.' },
  { header: 'inspector e-mail', required: true, description: 'The e-mail address of an active Whorl user.' },
  { header: 'result', required: true, description: 'accept, reject or indication recorded (the labels or the ids, any case).' },
  { header: 'instrument serial', required: false, description: 'Serial number of an instrument in the equipment register; may be empty.' },
  { header: 'probe serial', required: false, description: 'Serial number of a probe in the equipment register; may be empty.' },
  { header: 'reference standard serial', required: false, description: 'Serial number of a reference standard in the equipment register; may be empty.' },
  { header: 'notes', required: false, description: 'Free text, up to 2000 characters; may be empty.' },
] as const;
export type InspectionImportHeader = (typeof INSPECTION_IMPORT_COLUMNS)[number]['header'];

export interface InspectionImportError {
  /** The row as a spreadsheet numbers it: the header is row 1, the first inspection row 2. */
  row: number;
  /** The column's header, or "(file)" / "(row)" for problems that belong to no one column. */
  field: string;
  message: string;
}

/** One parsed row, resolved to the records it names (null where it names none or nothing that exists). */
export interface InspectionImportRow {
  row: number;
  performedOn: string;
  technique: { code: string; revision: string; revisionId: number | null };
  partNumber: string;
  serialNumber: string;
  workOrder: string;
  customer: string;
  inspector: { email: string; id: number | null; name: string | null };
  result: InspectionResult | null;
  instrument: { serialNumber: string; id: number | null } | null;
  probe: { serialNumber: string; id: number | null } | null;
  referenceStandard: { serialNumber: string; id: number | null } | null;
  notes: string | null;
}

export interface InspectionImportPreview {
  rows: InspectionImportRow[];
  errors: InspectionImportError[];
  /** Worth a look but not a reason to refuse the file (e.g. equipment past its calibration due date on the day). */
  warnings: InspectionImportError[];
  valid: boolean;
}

export interface InspectionImportResult {
  written: number;
}
