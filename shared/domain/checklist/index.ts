/**
 * The checklist engine: can this written eddy current technique, as written, find
 * the flaws it claims to find? Pure functions, no I/O. It supports the judgement of
 * a certified Level 3 and defers to the applicable standard, customer specification
 * and local regulations.
 *
 * API (keep stable: the server, client and register screens import it):
 *
 *   evaluateTechnique(input: unknown, options?) → ChecklistOutput
 *       Validates `input` with TechniqueSchema (and options.policy / options.registers),
 *       then evaluates. Throws the ZodError on invalid input.
 *   safeEvaluateTechnique(input: unknown, options?) → { success: true, output } | { success: false, error, issues }
 *       The same, never throws on invalid input; `issues` are { path: "coils[0].diameterMm", message, code }.
 *   parseTechnique(input: unknown) → { success: true, data: Technique } | { success: false, error, issues }
 *   evaluateParsedTechnique(technique: Technique, options?: EvaluateOptions) → ChecklistOutput
 *       Skips validation: for a technique already parsed (the live editor, benchmarks).
 *   formatIssues(issues) → string[]  ("path: message" lines for a terminal or log)
 *
 *   options: { policy?: Partial<Policy>  (the organisation's settings, merged over DEFAULT_POLICY;
 *                                         the technique's own `policy` is merged over these; treat
 *                                         the object as immutable: it is validated and merged once),
 *              registers?: RegisterFacts (approver, performers, equipment; enables the
 *                                         `personnel` and `equipment` rules),
 *              now?: Date                (the day certificates and calibrations are judged at) }
 *
 *   ChecklistOutput: { code, revision, verdict: 'conforms' | 'does-not-conform', summary: { pass, fail, warn, not_applicable },
 *                      values: { conductivityMsPerM, resistivityMicroOhmCm,
 *                                standardDepthMm[coil][frequency], effectiveDepthMm[coil][frequency],
 *                                limitFrequencyHz (part; null for plate and bore), frequencyRatio[coil][frequency],
 *                                fillFactor[coil], orientationSensitivity[flaw][coil] },
 *                      results: RuleResult[], policy: Policy (as used) }
 *   RuleResult: { rule: RuleId, status: 'pass' | 'fail' | 'warn' | 'not_applicable', flaw?: flaw id,
 *                 coil?: zero-based coil index, message, values, basis }
 *   verdict is 'does-not-conform' when any result fails; warnings never change it.
 *
 *   coilFieldAtDepth({ technique, relativePermeability }, coil, frequencyHz, depthMm, { flaw? }) → { model, densityRatio,
 *       planeWaveRatio, flawResponse, liftOffDirection, phaseSeparationDeg }: this coil's field at a depth (planar or long-coil
 *       model); planarLayers(part, conductivityIacs, μr, flaw?) → the layers under a scanning coil. Chart series: shared/domain/fields.
 *
 * Rule ids (RULE_IDS): orientation-coverage, center-effect, scan-index, penetration-depth, phase-separation, lift-off, edge-effect,
 * fill-factor, limit-frequency, ferromagnetic, reference-standard, coil-size, personnel, equipment.
 * Every rule reports at least one result (not_applicable when it does not apply), except personnel
 * and equipment, which report nothing without register facts.
 */
export {
  evaluateTechnique,
  safeEvaluateTechnique,
  parseTechnique,
  evaluateParsedTechnique,
  formatIssues,
  toIssues,
  issuePath,
} from './evaluate';
export type { TechniqueIssue, ParseResult, SafeEvaluateResult, UncheckedEvaluateOptions } from './evaluate';
export { RULE_IDS, CHECKLIST_ENGINE_VERSION } from './types';
export type {
  RuleId,
  RuleStatus,
  RuleResult,
  ResultValue,
  Verdict,
  ChecklistOutput,
  ChecklistSummary,
  ChecklistValues,
  EvaluateOptions,
} from './types';
export {
  RegisterFactsSchema,
  CertificationFactSchema,
  PersonFactSchema,
  EquipmentFactSchema,
  EQUIPMENT_KINDS,
} from './registers';
export type { RegisterFacts, RegisterFactsInput, CertificationFact, PersonFact, EquipmentFact, EquipmentKind } from './registers';
export { TechniqueSchema } from '../../schemas/technique';
export type { Technique, TechniqueInput } from '../../schemas/technique';
export { coilFieldAtDepth, planarLayers, createCoilFields, highestReachingFrequencyHz, bestPhaseSeparation } from './coil-field';
export type { CoilFieldAtDepth, CoilFields, FieldSetting, FieldModel } from './coil-field';
export { DEFAULT_POLICY, POLICY_SETTINGS, PolicySchema, PolicyOverrideSchema, mergePolicy } from '../policy';
export type { Policy, PolicyKey, PolicySetting, PolicyOverride } from '../policy';
