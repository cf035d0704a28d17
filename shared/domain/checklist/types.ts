// Shapes the checklist engine returns, and the context every rule reads.
import type { Policy } from '../policy';
import type { Vec3 } from '../orientation';
import type { Technique } from '../../schemas/technique';
import type { RegisterFacts } from './registers';
import type { DemonstrationFact } from './rules/demonstrated-capability';
import type { CoilFields } from './coil-field';

export const RULE_IDS = [
  'orientation-coverage',
  'center-effect',
  'scan-index',
  'penetration-depth',
  'phase-separation',
  'lift-off',
  'edge-effect',
  'fill-factor',
  'limit-frequency',
  'ferromagnetic',
  'reference-standard',
  'coil-size',
  'coil-mode',
  'personnel',
  'equipment',
  'demonstrated-capability',
] as const;

/**
 * The version of the rules' logic. Raise it when a rule's logic or a default
 * changes, so a recorded run (an extent-of-condition run, say) tells which
 * logic produced its list.
 */
export const CHECKLIST_ENGINE_VERSION = '2.0';

export type RuleId = (typeof RULE_IDS)[number];
export type RuleStatus = 'pass' | 'fail' | 'warn' | 'not_applicable';
export type Verdict = 'conforms' | 'does-not-conform';

export type ResultValue = number | string | boolean | null;

export interface RuleResult {
  rule: RuleId;
  status: RuleStatus;
  /** The flaw's `id` when the result is about one flaw. */
  flaw?: string;
  /** Zero-based index into `technique.coils` when the result is about one coil (messages say "coil 1" for index 0). */
  coil?: number;
  /** For an auditor: what is wrong, why, and what would fix it. */
  message: string;
  /** The numbers behind the result, units in the names. */
  values: Record<string, ResultValue>;
  /** The source the rule rests on, with its tag ([pub], [trade], [mem], product default). */
  basis: string;
}

export interface ChecklistValues {
  conductivityMsPerM: number;
  resistivityMicroOhmCm: number;
  /** standardDepthMm[c][i]: δ of coil c at its frequency frequenciesHz[i]. */
  standardDepthMm: number[][];
  /** effectiveDepthMm[c][i] = k·δ with the policy's penetration factor k (3 by default). */
  effectiveDepthMm: number[][];
  /** Limit frequency f_g of the part (solid bar, or thin-walled tube); null for plates and bores. */
  limitFrequencyHz: number | null;
  /** frequencyRatio[c][i] = f/f_g for encircling and bobbin coils; null for others or without f_g. */
  frequencyRatio: (number | null)[][];
  /** fillFactor[c]: η for encircling and bobbin coils; null for others. */
  fillFactor: (number | null)[];
  /** orientationSensitivity[f][c]: |current · normal| of flaw f for coil c. */
  orientationSensitivity: number[][];
  /** μr the field models use (the incremental permeability of a saturated part, else the material's). */
  fieldRelativePermeability: number;
}

export interface ChecklistSummary {
  pass: number;
  fail: number;
  warn: number;
  not_applicable: number;
}

export interface ChecklistOutput {
  code: string;
  revision: string;
  verdict: Verdict;
  summary: ChecklistSummary;
  values: ChecklistValues;
  results: RuleResult[];
  /** The policy the rules used: organisation policy with the technique's own override merged over it. */
  policy: Policy;
}

export interface EvaluateOptions {
  /** The organisation's policy settings, merged over DEFAULT_POLICY (the technique's `policy` is merged over these). */
  policy?: Partial<Policy>;
  /** Facts from the registers; the `personnel` and `equipment` rules run only when these are given. */
  registers?: RegisterFacts;
  /** The date certificates and calibrations are judged at (default: now). */
  now?: Date;
  /** The revision's accepted capability demonstrations; the `demonstrated-capability` rule runs only when these are given. */
  demonstrations?: DemonstrationFact[];
}

/** Everything a rule reads: the technique, the effective policy and the values worked out once. */
export interface RuleContext {
  technique: Technique;
  policy: Policy;
  registers: RegisterFacts | undefined;
  now: Date;
  values: ChecklistValues;
  flawNormals: Vec3[];
  /** "coil 1 (5 mm shielded surface)" for each coil, formatted once per evaluation. */
  coilNames: string[];
  demonstrations?: DemonstrationFact[];
  /** This technique's coil fields at its flaws (planar and long-coil models), memoised for the evaluation. */
  fields: CoilFields;
}

export type Rule = (context: RuleContext, results: RuleResult[]) => void;
