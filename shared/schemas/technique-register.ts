// Requests and views of the technique register (techniques, revisions, materials,
// the organisation's policy). The technique content itself is validated by the
// checklist engine's TechniqueSchema, so its issues read the same everywhere.
import { z } from 'zod';
import { ListQueryBaseSchema } from './common';
import { POLICY_SETTINGS, type Policy, type PolicyKey, type PolicySetting } from '../domain/policy';
import type { ChecklistOutput, RuleId, Verdict } from '../domain/checklist';
import type { Technique } from './technique';

export const TECHNIQUE_REVISION_STATES = ['draft', 'approved', 'superseded'] as const;
export type TechniqueRevisionState = (typeof TECHNIQUE_REVISION_STATES)[number];
export const VERDICTS = ['conforms', 'does-not-conform'] as const;

export { TECHNIQUE_STATE_LABELS } from '../labels/techniques';
export { VERDICT_LABELS } from '../labels/rules';

const areaId = z.number({ error: 'areaId must be an area id or null' }).int().positive().nullable();
const version = z.number({ error: 'version is required: the version you loaded' }).int().min(0);

export const TechniqueListQuerySchema = ListQueryBaseSchema.extend({
  state: z.enum(TECHNIQUE_REVISION_STATES, { error: `state must be one of ${TECHNIQUE_REVISION_STATES.join(', ')}` }).optional(),
  verdict: z.enum(VERDICTS, { error: `verdict must be one of ${VERDICTS.join(', ')}` }).optional(),
  areaId: z.coerce.number().int().positive().optional(),
}).strict();
export type TechniqueListQuery = z.infer<typeof TechniqueListQuerySchema>;

/** The technique content is checked by the engine's schema after this envelope. */
export const TechniqueCreateSchema = z.strictObject({
  areaId: areaId.optional(),
  technique: z.unknown().refine((value) => value !== undefined, { error: 'technique is required' }),
});

export const RevisionUpdateSchema = z.strictObject({
  version,
  areaId: areaId.optional(),
  technique: z.unknown().refine((value) => value !== undefined, { error: 'technique is required' }),
});

export const RevisionApproveSchema = z.strictObject({ version });

export const NewRevisionSchema = z.strictObject({});

export const RevisionParamsSchema = z.strictObject({
  id: z.coerce.number().int().positive(),
  rev: z.string().regex(/^[A-Za-z0-9.-]{1,20}$/, 'rev must be a revision such as A or B'),
});

export const ChecklistQuerySchema = z.strictObject({
  revision: z.string().regex(/^[A-Za-z0-9.-]{1,20}$/, 'revision must be a revision such as A or B').optional(),
});

function settingValueSchema(setting: PolicySetting) {
  const unit = setting.unit ? ` ${setting.unit}` : '';
  const range = `between ${setting.min} and ${setting.max}${unit}`;
  let schema = z
    .number({ error: `${setting.key} must be a number ${range}, or null for the default` })
    .min(setting.min, { error: `${setting.key} must be ${range}` })
    .max(setting.max, { error: `${setting.key} must be ${range}` });
  if (setting.integer) schema = schema.int({ error: `${setting.key} must be a whole number` });
  return schema.nullable().optional();
}

/** An admin's edit: new values by key; null puts a setting back to its default. */
export const PolicyUpdateSchema = z.strictObject({
  version,
  values: z.strictObject(
    Object.fromEntries(POLICY_SETTINGS.map((setting) => [setting.key, settingValueSchema(setting)])) as Record<
      PolicyKey,
      ReturnType<typeof settingValueSchema>
    >,
    { error: (issue) => (issue.code === 'unrecognized_keys' ? `Unknown policy setting ${issue.keys.join(', ')}` : 'values must be an object') },
  ),
});
export type PolicyUpdateInput = z.infer<typeof PolicyUpdateSchema>;

const materialFields = {
  name: z.string({ error: 'name is required' }).trim().min(1, 'name must not be empty').max(120),
  conductivityIacs: z.number({ error: 'conductivityIacs must be a number of %IACS' }).gt(0, 'conductivityIacs must be greater than 0 %IACS').max(120, 'conductivityIacs must be at most 120 %IACS'),
  relativePermeability: z.number({ error: 'relativePermeability must be a number' }).min(1, 'relativePermeability (μr) must be at least 1').max(1_000_000),
  source: z.string({ error: 'source is required: where the values come from' }).trim().min(1, 'source must say where the values come from').max(1000),
};
export const MaterialCreateSchema = z.strictObject(materialFields);
export const MaterialUpdateSchema = z.strictObject({
  version,
  name: materialFields.name.optional(),
  conductivityIacs: materialFields.conductivityIacs.optional(),
  relativePermeability: materialFields.relativePermeability.optional(),
  source: materialFields.source.optional(),
});
export const MaterialListQuerySchema = z.strictObject({ q: z.string().trim().max(120).optional() });
export type MaterialCreateInput = z.infer<typeof MaterialCreateSchema>;
export type MaterialUpdateInput = z.infer<typeof MaterialUpdateSchema>;

export interface PersonRef {
  id: number;
  name: string;
}

export type RevisionEvent = 'EDIT' | 'APPROVE';

export interface TechniqueRevisionView {
  id: number;
  revision: string;
  state: TechniqueRevisionState;
  content: Technique;
  verdict: Verdict;
  failedRules: RuleId[];
  createdBy: PersonRef | null;
  createdAt: string;
  updatedBy: PersonRef | null;
  updatedAt: string;
  approvedBy: PersonRef | null;
  approvedAt: string | null;
  supersededAt: string | null;
  version: number;
  /** What this user may do to the revision now. */
  allowedEvents: RevisionEvent[];
}

export interface TechniqueListItem {
  id: number;
  code: string;
  title: string;
  areaId: number | null;
  areaName: string | null;
  /** The latest revision. */
  revision: string;
  state: TechniqueRevisionState;
  verdict: Verdict;
  failedRules: RuleId[];
  /** The approved revision in force, when it is not the latest. */
  approvedRevision: string | null;
  updatedAt: string;
}

export interface TechniqueView {
  id: number;
  code: string;
  title: string;
  areaId: number | null;
  areaName: string | null;
  createdAt: string;
  /** The revision the checklist evaluates: the approved one in force, else the latest. */
  currentRevision: string;
  /** Newest first. */
  revisions: TechniqueRevisionView[];
  allowedEvents: ('NEW_REVISION')[];
}

export interface TechniqueChecklistView {
  techniqueId: number;
  code: string;
  revision: { id: number; revision: string; state: TechniqueRevisionState; approvedBy: PersonRef | null; approvedAt: string | null };
  /** Whether facts from the personnel and equipment registers were included. */
  registersIncluded: boolean;
  evaluatedAt: string;
  output: ChecklistOutput;
}

export interface MaterialView {
  id: number;
  libraryKey: string | null;
  name: string;
  conductivityIacs: number;
  relativePermeability: number;
  source: string;
  version: number;
}

export interface PolicySettingView extends PolicySetting {
  value: number;
  isDefault: boolean;
  updatedAt: string | null;
  updatedBy: PersonRef | null;
}

export interface PolicyView {
  version: number;
  updatedAt: string | null;
  updatedBy: PersonRef | null;
  settings: PolicySettingView[];
  /** The organisation's policy: defaults merged with the stored values. */
  policy: Policy;
}
