import { z } from 'zod';
import { IsoDateSchema, ListQueryBaseSchema } from './common';
import type { CertificateFlag, VisionFlag } from '../registers/flags';

export const NDT_METHODS = ['ET', 'UT', 'PT', 'MT', 'RT', 'VT', 'LT', 'IRT'] as const;
export const CERTIFICATION_SCHEMES = ['ISO 9712', 'EN 4179', 'written practice'] as const;
export { CERTIFICATION_SCHEME_LABELS } from '../labels/techniques';

const sectorsSchema = z
  .array(z.string().trim().min(1, 'a sector must not be empty').max(40, 'a sector has at most 40 characters').regex(/^[^,]+$/, 'a sector must not contain a comma'))
  .max(8, 'at most 8 sectors');

const certificationFields = {
  userId: z.number().int().positive(),
  method: z.enum(NDT_METHODS, { error: `method must be one of ${NDT_METHODS.join(', ')}` }),
  level: z.union([z.literal(1), z.literal(2), z.literal(3)], { error: 'level must be 1, 2 or 3' }),
  scheme: z.enum(CERTIFICATION_SCHEMES, { error: `scheme must be one of ${CERTIFICATION_SCHEMES.join(', ')}` }),
  certificateNumber: z.string().trim().min(1, 'enter the certificate number').max(60),
  issuedOn: IsoDateSchema,
  expiresOn: IsoDateSchema,
  nearVisionExamOn: IsoDateSchema.nullable().default(null),
  colourVisionCheckedOn: IsoDateSchema.nullable().default(null),
  sectors: sectorsSchema.default([]),
  notes: z.string().trim().max(2000).nullable().default(null),
};

const expiresAfterIssue = (value: { issuedOn?: string; expiresOn?: string }) =>
  !value.issuedOn || !value.expiresOn || value.expiresOn > value.issuedOn;

export const CertificationCreateSchema = z
  .object(certificationFields)
  .strict()
  .refine(expiresAfterIssue, { message: 'the expiry date must be after the issue date', path: ['expiresOn'] });

export const CertificationUpdateSchema = z
  .object({
    version: z.number().int().min(0),
    method: certificationFields.method.optional(),
    level: certificationFields.level.optional(),
    scheme: certificationFields.scheme.optional(),
    certificateNumber: certificationFields.certificateNumber.optional(),
    issuedOn: IsoDateSchema.optional(),
    expiresOn: IsoDateSchema.optional(),
    nearVisionExamOn: IsoDateSchema.nullable().optional(),
    colourVisionCheckedOn: IsoDateSchema.nullable().optional(),
    sectors: sectorsSchema.optional(),
    notes: z.string().trim().max(2000).nullable().optional(),
    active: z.boolean().optional(),
  })
  .strict();

export const CERTIFICATION_FLAG_FILTERS = ['expired', 'expiring', 'vision-overdue', 'attention'] as const;

export const CertificationListQuerySchema = ListQueryBaseSchema.extend({
  method: z.enum(NDT_METHODS).optional(),
  level: z.coerce.number().int().min(1).max(3).optional(),
  scheme: z.enum(CERTIFICATION_SCHEMES).optional(),
  userId: z.coerce.number().int().positive().optional(),
  flag: z.enum(CERTIFICATION_FLAG_FILTERS).optional(),
  active: z.enum(['true', 'false']).optional(),
}).strict();

export type CertificationCreateInput = z.infer<typeof CertificationCreateSchema>;
export type CertificationUpdateInput = z.infer<typeof CertificationUpdateSchema>;
export type CertificationListQuery = z.infer<typeof CertificationListQuerySchema>;

export interface CertificationView {
  id: number;
  userId: number;
  personName: string;
  personEmail: string;
  method: string;
  level: 1 | 2 | 3;
  scheme: string;
  certificateNumber: string;
  issuedOn: string;
  expiresOn: string;
  nearVisionExamOn: string | null;
  colourVisionCheckedOn: string | null;
  sectors: string[];
  notes: string | null;
  active: boolean;
  version: number;
  certificate: CertificateFlag;
  vision: VisionFlag;
}
