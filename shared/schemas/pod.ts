// Capability demonstrations (probability of detection): what a Level 3 records, and the
// requests that analyse and accept one. Strict: unknown fields are refused.
import { z } from 'zod';
import { IsoDateSchema } from './common';

export const POD_MODELS = ['hit-miss', 'signal-response'] as const;
export type PodModel = (typeof POD_MODELS)[number];
export const POD_SIZE_DIMENSIONS = ['length', 'depth'] as const;
export type PodSizeDimension = (typeof POD_SIZE_DIMENSIONS)[number];
export const POD_DEMONSTRATION_STATES = ['draft', 'accepted', 'superseded'] as const;
export type PodDemonstrationState = (typeof POD_DEMONSTRATION_STATES)[number];

export const POD_MODEL_LABELS: Record<PodModel, string> = { 'hit-miss': 'Hit/miss', 'signal-response': 'Signal response (â vs a)' };
export const POD_STATE_LABELS: Record<PodDemonstrationState, string> = { draft: 'Draft', accepted: 'Accepted', superseded: 'Superseded' };

const text = (max: number) => z.string().trim().min(1, 'required').max(max, `at most ${max} characters`);
const positive = z.number().positive('must be greater than zero').finite();

export const PodSpecimenSchema = z
  .object({ specimenId: text(60), flawId: text(60), sizeMm: positive.max(1000, 'at most 1000 mm'), flawType: text(60) })
  .strict();

export const PodResultSchema = z
  .object({ flawId: text(60), hit: z.boolean().optional(), signal: z.number().min(0, 'cannot be negative').finite().optional() })
  .strict();

export const PodInspectionSchema = z
  .object({
    inspectorId: z.number().int().positive(),
    performedOn: IsoDateSchema,
    equipmentIds: z.array(z.number().int().positive()).max(6).default([]),
    results: z.array(PodResultSchema).min(1, 'at least one result').max(5000),
  })
  .strict();

export const PodDemonstrationFieldsSchema = z
  .object({
    techniqueRevisionId: z.number().int().positive(),
    title: text(160),
    model: z.enum(POD_MODELS),
    sizeDimension: z.enum(POD_SIZE_DIMENSIONS),
    link: z.enum(['logit', 'probit']).default('logit'),
    signalUnits: z.string().trim().max(40).optional(),
    recordingThreshold: positive.optional(),
    saturation: positive.optional(),
    decisionThreshold: positive.optional(),
    specimens: z.array(PodSpecimenSchema).min(2, 'at least two flaws').max(5000),
    inspections: z.array(PodInspectionSchema).min(1, 'at least one inspection').max(50),
    noise: z.array(z.number().min(0, 'cannot be negative').finite()).max(5000).default([]),
  })
  .strict()
  .superRefine((value, ctx) => {
    const flaws = new Set<string>();
    value.specimens.forEach((s, i) => {
      if (flaws.has(s.flawId)) ctx.addIssue({ code: 'custom', path: ['specimens', i, 'flawId'], message: 'this flaw id is already used' });
      flaws.add(s.flawId);
    });
    if (value.model === 'signal-response' && value.decisionThreshold === undefined)
      ctx.addIssue({ code: 'custom', path: ['decisionThreshold'], message: 'a signal-response demonstration needs a decision threshold' });
    if (value.model === 'signal-response' && !value.signalUnits)
      ctx.addIssue({ code: 'custom', path: ['signalUnits'], message: 'state the units of the signal' });
    value.inspections.forEach((inspection, i) =>
      inspection.results.forEach((r, j) => {
        const path = ['inspections', i, 'results', j];
        if (!flaws.has(r.flawId)) ctx.addIssue({ code: 'custom', path: [...path, 'flawId'], message: 'no specimen has this flaw id' });
        if (value.model === 'hit-miss' && r.hit === undefined) ctx.addIssue({ code: 'custom', path: [...path, 'hit'], message: 'hit or miss is required' });
        if (value.model === 'signal-response' && r.signal === undefined)
          ctx.addIssue({ code: 'custom', path: [...path, 'signal'], message: 'the signal is required' });
      }),
    );
  });
export type PodDemonstrationFieldsInput = z.infer<typeof PodDemonstrationFieldsSchema>;
/** What is stored as the demonstration's data: the fields without the revision, title, model and dimension columns. */
export type PodDemonstrationData = Omit<PodDemonstrationFieldsInput, 'techniqueRevisionId' | 'title' | 'model' | 'sizeDimension'>;

const version = z.number().int().min(0);
export const PodDemonstrationUpdateSchema = PodDemonstrationFieldsSchema.safeExtend({ version }).strict();
export const PodAnalyseSchema = z.object({ version }).strict();
export const PodAcceptSchema = z
  .object({ version, password: z.string({ error: 'your password is required to sign' }).min(1, 'your password is required to sign').max(1024) })
  .strict();
export const PodListQuerySchema = z.object({ techniqueRevisionId: z.coerce.number().int().positive().optional() }).strict();
