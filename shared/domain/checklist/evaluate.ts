// Runs every rule over a technique and gathers the verdict.
import { z } from 'zod';
import { DEFAULT_POLICY, mergePolicy, PolicyOverrideSchema, type Policy } from '../policy';
import { TechniqueSchema, type Technique } from '../../schemas/technique';
import { buildContext } from './context';
import { RegisterFactsSchema, type RegisterFacts } from './registers';
import type { ChecklistOutput, ChecklistSummary, EvaluateOptions, Rule, RuleResult } from './types';
import { orientationCoverage } from './rules/orientation-coverage';
import { centerEffect } from './rules/center-effect';
import { scanIndex } from './rules/scan-index';
import { penetrationDepth } from './rules/penetration-depth';
import { phaseSeparation } from './rules/phase-separation';
import { liftOff } from './rules/lift-off';
import { edgeEffect } from './rules/edge-effect';
import { fillFactor } from './rules/fill-factor';
import { limitFrequency } from './rules/limit-frequency';
import { ferromagnetic } from './rules/ferromagnetic';
import { referenceStandard } from './rules/reference-standard';
import { coilSize } from './rules/coil-size';
import { coilMode } from './rules/coil-mode';
import { personnel } from './rules/personnel';
import { equipment } from './rules/equipment';
import { demonstratedCapability, DemonstrationFactsSchema } from './rules/demonstrated-capability';

/** In the order results are reported. `personnel` and `equipment` add results only when register facts are given. */
const RULES: readonly Rule[] = [
  orientationCoverage,
  centerEffect,
  scanIndex,
  penetrationDepth,
  phaseSeparation,
  liftOff,
  edgeEffect,
  fillFactor,
  limitFrequency,
  ferromagnetic,
  referenceStandard,
  coilSize,
  coilMode,
  personnel,
  equipment,
  demonstratedCapability,
];

// The organisation's policy usually arrives as the same object call after call:
// merge it over the defaults once.
const orgPolicyCache = new WeakMap<object, Policy>();

function resolvePolicy(orgOverride: Partial<Policy> | undefined, techniqueOverride: Partial<Policy> | undefined): Policy {
  let org: Policy = DEFAULT_POLICY;
  if (orgOverride) {
    const cached = orgPolicyCache.get(orgOverride);
    if (cached) org = cached;
    else {
      org = mergePolicy(DEFAULT_POLICY, orgOverride);
      orgPolicyCache.set(orgOverride, org);
    }
  }
  return mergePolicy(org, techniqueOverride);
}

/** Evaluates a technique that has already passed `TechniqueSchema` (skips validation: the fast path). */
export function evaluateParsedTechnique(technique: Technique, options: EvaluateOptions = {}): ChecklistOutput {
  const policy = resolvePolicy(options.policy, technique.policy);
  const context = { ...buildContext(technique, policy, options.registers, options.now ?? new Date()), demonstrations: options.demonstrations };
  const results: RuleResult[] = [];
  for (const rule of RULES) rule(context, results);
  const summary: ChecklistSummary = { pass: 0, fail: 0, warn: 0, not_applicable: 0 };
  for (const result of results) summary[result.status]++;
  return {
    code: technique.code,
    revision: technique.revision,
    verdict: summary.fail > 0 ? 'does-not-conform' : 'conforms',
    summary,
    values: context.values,
    results,
    policy,
  };
}

/** One validation problem: where (a dotted path such as "coils[0].diameterMm") and what is wrong. */
export interface TechniqueIssue {
  path: string;
  message: string;
  code: string;
}

export type ParseResult<T> = { success: true; data: T } | { success: false; error: z.ZodError; issues: TechniqueIssue[] };

export function issuePath(path: readonly PropertyKey[]): string {
  let text = '';
  for (const key of path) {
    if (typeof key === 'number') text += `[${key}]`;
    else text += text ? `.${String(key)}` : String(key);
  }
  return text;
}

export function toIssues(error: z.ZodError, prefix?: string): TechniqueIssue[] {
  return error.issues.map((issue) => {
    const path = issuePath(issue.path);
    return { path: prefix ? (path ? `${prefix}.${path}` : prefix) : path, message: issue.message, code: issue.code };
  });
}

/** "coils[0].diameterMm: Coil diameter … must be greater than 0 mm", one line per issue. */
export function formatIssues(issues: readonly TechniqueIssue[]): string[] {
  return issues.map((issue) => (issue.path ? `${issue.path}: ${issue.message}` : issue.message));
}

/** Validates a technique without throwing. */
export function parseTechnique(input: unknown): ParseResult<Technique> {
  const parsed = TechniqueSchema.safeParse(input);
  return parsed.success ? { success: true, data: parsed.data } : { success: false, error: parsed.error, issues: toIssues(parsed.error) };
}

export interface UncheckedEvaluateOptions {
  policy?: unknown;
  registers?: unknown;
  now?: Date;
  demonstrations?: unknown;
}

type OptionsParse = { success: true; options: EvaluateOptions } | { success: false; error: z.ZodError; issues: TechniqueIssue[] };

const validatedOrgPolicies = new WeakSet<object>();

function parseOptions(options: UncheckedEvaluateOptions | undefined): OptionsParse {
  if (!options) return { success: true, options: {} };
  const parsedOptions: EvaluateOptions = {};
  if (options.now !== undefined) {
    if (!(options.now instanceof Date) || Number.isNaN(options.now.getTime())) {
      const error = new z.ZodError([{ code: 'custom', path: ['now'], message: 'now must be a valid Date', input: options.now }]);
      return { success: false, error, issues: toIssues(error, 'options') };
    }
    parsedOptions.now = options.now;
  }
  if (options.policy !== undefined && options.policy !== null) {
    // An unchanged policy object is validated once (callers pass the organisation's policy again and again).
    if (typeof options.policy === 'object' && validatedOrgPolicies.has(options.policy)) {
      parsedOptions.policy = options.policy as Partial<Policy>;
    } else {
      const policy = PolicyOverrideSchema.safeParse(options.policy);
      if (!policy.success) return { success: false, error: policy.error, issues: toIssues(policy.error, 'options.policy') };
      validatedOrgPolicies.add(options.policy as object);
      parsedOptions.policy = options.policy as Partial<Policy>;
    }
  }
  if (options.registers !== undefined && options.registers !== null) {
    const registers = RegisterFactsSchema.safeParse(options.registers);
    if (!registers.success) return { success: false, error: registers.error, issues: toIssues(registers.error, 'options.registers') };
    parsedOptions.registers = registers.data as RegisterFacts;
  }
  if (options.demonstrations !== undefined && options.demonstrations !== null) {
    const demonstrations = DemonstrationFactsSchema.safeParse(options.demonstrations);
    if (!demonstrations.success) return { success: false, error: demonstrations.error, issues: toIssues(demonstrations.error, 'options.demonstrations') };
    parsedOptions.demonstrations = demonstrations.data;
  }
  return { success: true, options: parsedOptions };
}

/** Validates, then evaluates. Throws the ZodError on invalid input (the server maps it to 400). */
export function evaluateTechnique(input: unknown, options?: UncheckedEvaluateOptions): ChecklistOutput {
  const outcome = safeEvaluateTechnique(input, options);
  if (!outcome.success) throw outcome.error;
  return outcome.output;
}

export type SafeEvaluateResult = { success: true; output: ChecklistOutput } | { success: false; error: z.ZodError; issues: TechniqueIssue[] };

/** Validates, then evaluates; invalid input comes back as issues, never as an exception. */
export function safeEvaluateTechnique(input: unknown, options?: UncheckedEvaluateOptions): SafeEvaluateResult {
  const parsed = parseTechnique(input);
  if (!parsed.success) return parsed;
  const parsedOptions = parseOptions(options);
  if (!parsedOptions.success) return parsedOptions;
  return { success: true, output: evaluateParsedTechnique(parsed.data, parsedOptions.options) };
}
