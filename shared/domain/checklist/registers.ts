// Facts from the registers that the server supplies to the `personnel` and
// `equipment` rules (docs/domain-rules.md, "People and equipment"). The engine reads only these facts: it
// never looks anything up itself.
import { z } from 'zod';

const dateField = (field: string) =>
  z
    .union([z.date(), z.iso.date(), z.iso.datetime({ offset: true })], {
      error: `${field} must be a date (YYYY-MM-DD or an ISO date-time)`,
    })
    .transform((value) => (value instanceof Date ? value : new Date(value)))
    .refine((date) => !Number.isNaN(date.getTime()), { error: `${field} is not a valid date` });

const text = (field: string, max: number) =>
  z
    .string({ error: `${field} must be text` })
    .trim()
    .min(1, { error: `${field} must not be empty` })
    .max(max, { error: `${field} must be at most ${max} characters` });

const idField = z.union([z.string().max(100), z.number().int()], { error: 'id must be a string or an integer' });

export const CertificationFactSchema = z.strictObject({
  /** Method code as certified, e.g. "ET" (compared case-insensitively). */
  method: text('method', 20),
  level: z.union([z.literal(1), z.literal(2), z.literal(3)], { error: 'level must be 1, 2 or 3' }),
  scheme: text('scheme', 60).optional(),
  certificateNumber: text('certificateNumber', 60).optional(),
  issuedOn: dateField('issuedOn').optional(),
  expiresOn: dateField('expiresOn'),
});

export const PersonFactSchema = z.strictObject({
  id: idField.optional(),
  name: text('name', 200),
  certifications: z.array(CertificationFactSchema, { error: 'certifications must be a list' }).max(50),
  /** Date of the last near-vision exam; null or absent when none is on record. */
  nearVisionExamOn: dateField('nearVisionExamOn').nullable().optional(),
});

export const EQUIPMENT_KINDS = ['instrument', 'probe', 'reference-standard'] as const;
export type EquipmentKind = (typeof EQUIPMENT_KINDS)[number];

export const EquipmentFactSchema = z.strictObject({
  id: idField.optional(),
  kind: z.enum(EQUIPMENT_KINDS, { error: `kind must be one of ${EQUIPMENT_KINDS.join(', ')}` }),
  description: text('description', 200),
  serialNumber: text('serialNumber', 100).optional(),
  /** Calibration due date; null when the item has no calibration record. */
  calibrationDueOn: dateField('calibrationDueOn').nullable(),
});

export const RegisterFactsSchema = z.strictObject({
  /** The Level 3 who approved the technique; null when it has no recorded approval. */
  approver: PersonFactSchema.nullable().optional(),
  /** When the technique was approved (the approver's certificate is judged on that date). */
  approvedOn: dateField('approvedOn').optional(),
  /** The people authorised to perform the technique. */
  performers: z.array(PersonFactSchema, { error: 'performers must be a list' }).max(500).optional(),
  /** Instruments, probes and reference standards the technique calls for. */
  equipment: z.array(EquipmentFactSchema, { error: 'equipment must be a list' }).max(500).optional(),
});

/** Register facts after validation (dates are Date objects). */
export type RegisterFacts = z.infer<typeof RegisterFactsSchema>;
/** What the server may send: dates as Date objects or ISO strings. */
export type RegisterFactsInput = z.input<typeof RegisterFactsSchema>;
export type CertificationFact = z.infer<typeof CertificationFactSchema>;
export type PersonFact = z.infer<typeof PersonFactSchema>;
export type EquipmentFact = z.infer<typeof EquipmentFactSchema>;

const DAY_MS = 86_400_000;

/** Whole UTC days since the epoch: certificates and calibrations are dated by the day. */
export function utcDay(date: Date): number {
  return Math.floor(date.getTime() / DAY_MS);
}

/** The same calendar day `months` later (clamped to the month's end: 31 Jan + 1 month = 28/29 Feb), as a UTC day number. */
export function utcDayPlusMonths(date: Date, months: number): number {
  const year = date.getUTCFullYear();
  const month = date.getUTCMonth() + months;
  const lastDay = new Date(Date.UTC(year, month + 1, 0)).getUTCDate();
  const day = Math.min(date.getUTCDate(), lastDay);
  return utcDay(new Date(Date.UTC(year, month, day)));
}

export function isoDay(date: Date): string {
  return date.toISOString().slice(0, 10);
}
