// The organisation's policy: every threshold docs/domain.md and docs/domain-rules.md
// tag as common practice ([trade]), recalled from memory ([mem]) or a product default
// is a setting with a default here, editable by the organisation, never a constant
// buried in a rule.
import { z } from 'zod';

export interface PolicySetting {
  key: PolicyKey;
  label: string;
  defaultValue: number;
  unit: string;
  /** Where the default comes from, as an auditor would want it stated. */
  basis: string;
  min: number;
  max: number;
  /** Whole numbers only (days, months, years). */
  integer?: boolean;
}

const TRADE = 'common practice, no single source';
const MEMORY = 'from memory, not verified against the text';
const PRODUCT = 'Whorl product default, no published source';

export const POLICY_KEYS = [
  'orientationSensitivityMin',
  'scanIndexFractionMax',
  'shortCrackFraction',
  'penetrationDepthFactor',
  'densityRatioMin',
  'phaseSeparationMinDeg',
  'shimTolerancePercent',
  'liftOffSensitivityLossMaxPercent',
  'edgeZoneUnshieldedDiameters',
  'edgeZoneShieldedDiameters',
  'edgeNotchToleranceMm',
  'fillFactorMinEncircling',
  'fillFactorMinInternal',
  'limitFrequencyRatioMin',
  'limitFrequencyRatioMax',
  'referenceConductivityTolerancePercent',
  'notchOrientationToleranceDeg',
  'notchDepthRatioMax',
  'ferromagneticPermeabilityMin',
  'saturatedIncrementalPermeability',
  'differentialSpacingDiameters',
  'differentialLengthFailMultiple',
  'certificateValidityYears',
  'nearVisionExamMonths',
  'demonstrationRequired',
  'missingDemonstrationFails',
  'demonstrationValidityMonths',
  'findingDueDaysMajor',
  'findingContainmentDays',
  'findingDueDaysMinor',
] as const;

export type PolicyKey = (typeof POLICY_KEYS)[number];
export type Policy = Record<PolicyKey, number>;

export const POLICY_SETTINGS: readonly PolicySetting[] = [
  {
    key: 'orientationSensitivityMin',
    label: 'Orientation sensitivity threshold (|current · flaw normal|)',
    defaultValue: 0.5,
    unit: '',
    basis: PRODUCT,
    min: 0.01,
    max: 1,
  },
  {
    key: 'scanIndexFractionMax',
    label: 'Largest scan index, as a fraction of the coil diameter',
    defaultValue: 0.5,
    unit: '× coil diameter',
    basis: TRADE,
    min: 0.05,
    max: 1,
  },
  {
    key: 'shortCrackFraction',
    label: 'Short-crack warning below this fraction of the coil diameter',
    defaultValue: 0.5,
    unit: '× coil diameter',
    basis: 'published military eddy current manual (cracks shorter than about half the coil diameter are hard to detect)',
    min: 0,
    max: 2,
  },
  {
    key: 'penetrationDepthFactor',
    label: 'Deepest detectable flaw, in standard depths (k in x ≤ k·δ)',
    defaultValue: 3,
    unit: '× δ',
    basis: `${TRADE} (effective depth of penetration ≈ 3δ, where current density is 5 % of the surface value)`,
    min: 0.5,
    max: 5,
  },
  {
    key: 'densityRatioMin',
    label: "Least eddy current density at the flaw, as a fraction of the density at the surface (this coil's field)",
    defaultValue: 0.0498,
    unit: '× surface density',
    basis: `${TRADE} (the effective depth of penetration 3δ is where a plane wave's density has fallen to e^(−3) ≈ 0.0498 of the surface value; the same fraction is asked of the coil's own field)`,
    min: 0.001,
    max: 0.9,
  },
  {
    key: 'phaseSeparationMinDeg',
    label: 'Least angle between the lift-off and flaw signals on the impedance plane',
    defaultValue: 30,
    unit: '°',
    basis: `${PRODUCT}: below about 30° a flaw signal is hard to tell from lift-off wobble by its phase; the trade aims for about 90° (δ ≈ 1.25 × flaw depth)`,
    min: 1,
    max: 90,
  },
  {
    key: 'shimTolerancePercent',
    label: 'Calibration shim within ± of the coating thickness',
    defaultValue: 10,
    unit: '%',
    basis: PRODUCT,
    min: 0,
    max: 100,
  },
  {
    key: 'liftOffSensitivityLossMaxPercent',
    label: 'Largest loss of flaw signal to the coating before a warning',
    defaultValue: 50,
    unit: '%',
    basis: `${PRODUCT} (half the signal, 6 dB, is the usual point at which a sensitivity change is re-examined)`,
    min: 0,
    max: 99,
  },
  {
    key: 'edgeZoneUnshieldedDiameters',
    label: 'Edge zone of an unshielded coil',
    defaultValue: 2,
    unit: '× coil diameter',
    basis: MEMORY,
    min: 0,
    max: 10,
  },
  {
    key: 'edgeZoneShieldedDiameters',
    label: 'Edge zone of a shielded coil',
    defaultValue: 0.5,
    unit: '× coil diameter',
    basis: MEMORY,
    min: 0,
    max: 10,
  },
  {
    key: 'edgeNotchToleranceMm',
    label: 'Edge notch counts as "at the same edge distance" within',
    defaultValue: 0.25,
    unit: 'mm',
    basis: PRODUCT,
    min: 0,
    max: 10,
  },
  {
    key: 'fillFactorMinEncircling',
    label: 'Minimum fill factor, encircling coil',
    defaultValue: 0.7,
    unit: '',
    basis: TRADE,
    min: 0.1,
    max: 1,
  },
  {
    key: 'fillFactorMinInternal',
    label: 'Minimum fill factor, internal (bobbin) coil',
    defaultValue: 0.8,
    unit: '',
    basis: TRADE,
    min: 0.1,
    max: 1,
  },
  {
    key: 'limitFrequencyRatioMin',
    label: 'Working window for crack detection, lowest f/f_g',
    defaultValue: 5,
    unit: '× f_g',
    basis: MEMORY,
    min: 0.1,
    max: 1000,
  },
  {
    key: 'limitFrequencyRatioMax',
    label: 'Working window for crack detection, highest f/f_g',
    defaultValue: 15,
    unit: '× f_g',
    basis: MEMORY,
    min: 0.1,
    max: 10000,
  },
  {
    key: 'referenceConductivityTolerancePercent',
    label: 'Reference standard conductivity within ± of the part',
    defaultValue: 15,
    unit: '%',
    basis: TRADE,
    min: 0,
    max: 100,
  },
  {
    key: 'notchOrientationToleranceDeg',
    label: 'A notch matches a flaw orientation within',
    defaultValue: 10,
    unit: '°',
    basis: PRODUCT,
    min: 0,
    max: 45,
  },
  {
    key: 'notchDepthRatioMax',
    label: 'Largest notch depth, as a fraction of the smallest flaw depth',
    defaultValue: 1,
    unit: '× flaw depth',
    basis: TRADE,
    min: 0.1,
    max: 10,
  },
  {
    key: 'ferromagneticPermeabilityMin',
    label: 'A material counts as ferromagnetic from this relative permeability μr',
    defaultValue: 1.05,
    unit: 'μr',
    basis:
      `${TRADE} (specifications for non-magnetic grades commonly set μr ≤ 1.05; titanium alloys ≈ 1.0001 and annealed austenitic stainless ≈ 1.003–1.02 stay below it: figures recalled, to be confirmed against the material data)`,
    min: 1.000001,
    max: 100,
  },
  {
    key: 'saturatedIncrementalPermeability',
    label: 'Incremental μr of a magnetically saturated material, when the technique gives none',
    defaultValue: 2,
    unit: 'μr',
    basis:
      'from memory, not verified against the text: under the saturating field of tube and bar test equipment the incremental permeability falls to between 1 (full saturation) and a few; 2 errs toward a shallower depth of penetration',
    min: 1,
    max: 1000,
  },
  {
    key: 'differentialSpacingDiameters',
    label: 'Spacing of the two windings of a differential coil, when the technique gives none',
    defaultValue: 0.5,
    unit: '× coil diameter',
    basis: `${PRODUCT} (two coils of half the probe diameter side by side, or two windings of an encircling coil about half a diameter apart)`,
    min: 0.01,
    max: 10,
  },
  {
    key: 'differentialLengthFailMultiple',
    label: 'A differential coil fails a flaw longer than this multiple of its winding spacing',
    defaultValue: 5,
    unit: '× spacing',
    basis: `${PRODUCT} (a differential coil sees a long uniform flaw only at its ends; longer than the spacing warns, longer than this multiple fails unless an absolute coil covers it)`,
    min: 1,
    max: 1000,
  },
  {
    key: 'certificateValidityYears',
    label: 'Longest validity of an ET certificate',
    defaultValue: 5,
    unit: 'years',
    basis: 'from memory: ISO 9712 / EN 4179 (not verified against the text)',
    min: 1,
    max: 10,
    integer: true,
  },
  {
    key: 'demonstrationRequired',
    label: 'Capability demonstration required for every technique (1 yes, 0 no)',
    defaultValue: 0,
    unit: '',
    basis: PRODUCT,
    min: 0,
    max: 1,
    integer: true,
  },
  {
    key: 'missingDemonstrationFails',
    label: 'A required demonstration that is missing or expired fails the checklist (1) or warns (0)',
    defaultValue: 1,
    unit: '',
    basis: PRODUCT,
    min: 0,
    max: 1,
    integer: true,
  },
  {
    key: 'demonstrationValidityMonths',
    label: 'Longest age of an accepted capability demonstration',
    defaultValue: 60,
    unit: 'months',
    basis: PRODUCT,
    min: 1,
    max: 240,
    integer: true,
  },
  {
    key: 'nearVisionExamMonths',
    label: 'Near-vision exam no older than',
    defaultValue: 12,
    unit: 'months',
    basis: 'ISO 9712 (annual near-vision acuity check)',
    min: 1,
    max: 60,
    integer: true,
  },
  {
    key: 'findingDueDaysMajor',
    label: 'Corrective action due, major finding',
    defaultValue: 30,
    unit: 'days',
    basis: TRADE,
    min: 1,
    max: 365,
    integer: true,
  },
  {
    key: 'findingContainmentDays',
    label: 'Containment due, major finding',
    defaultValue: 1,
    unit: 'days',
    basis: TRADE,
    min: 0,
    max: 30,
    integer: true,
  },
  {
    key: 'findingDueDaysMinor',
    label: 'Corrective action due, minor finding',
    defaultValue: 90,
    unit: 'days',
    basis: `${TRADE} (aviation maintenance regulation allows no more than three months, extendable on an accepted plan)`,
    min: 1,
    max: 365,
    integer: true,
  },
];

export const POLICY_SETTINGS_BY_KEY: Readonly<Record<PolicyKey, PolicySetting>> = Object.freeze(
  Object.fromEntries(POLICY_SETTINGS.map((setting) => [setting.key, setting])) as Record<PolicyKey, PolicySetting>,
);

export const DEFAULT_POLICY: Readonly<Policy> = Object.freeze(
  Object.fromEntries(POLICY_SETTINGS.map((setting) => [setting.key, setting.defaultValue])) as Policy,
);

function settingSchema(setting: PolicySetting) {
  const unit = setting.unit ? ` ${setting.unit}` : '';
  const range = `between ${setting.min} and ${setting.max}${unit}`;
  let schema = z
    .number({ error: `${setting.key} (${setting.label}) must be a number ${range}` })
    .min(setting.min, { error: `${setting.key} (${setting.label}) must be ${range}` })
    .max(setting.max, { error: `${setting.key} (${setting.label}) must be ${range}` });
  if (setting.integer) schema = schema.int({ error: `${setting.key} (${setting.label}) must be a whole number` });
  return schema;
}

const policyShape = Object.fromEntries(POLICY_SETTINGS.map((setting) => [setting.key, settingSchema(setting)])) as Record<
  PolicyKey,
  z.ZodNumber
>;

const unknownKeyError = (issue: { code?: string; keys?: string[] }) =>
  issue.code === 'unrecognized_keys'
    ? `Unknown policy setting ${(issue.keys ?? []).map((key) => `"${key}"`).join(', ')}; known settings: ${POLICY_KEYS.join(', ')}`
    : undefined;

/** A complete policy (what the organisation stores). */
export const PolicySchema = z
  .strictObject(policyShape, { error: unknownKeyError })
  .refine((policy) => policy.limitFrequencyRatioMin < policy.limitFrequencyRatioMax, {
    error: 'limitFrequencyRatioMin must be below limitFrequencyRatioMax',
    path: ['limitFrequencyRatioMin'],
  });

/** Some settings, merged over a complete policy (a technique's own override, an admin's edit). */
export const PolicyOverrideSchema = z.strictObject(policyShape, { error: unknownKeyError }).partial();

export type PolicyOverride = z.infer<typeof PolicyOverrideSchema>;

/**
 * Settings of `override` replace those of `orgPolicy`; undefined values are ignored.
 * Returns `orgPolicy` itself when there is nothing to merge, so callers can cache on identity.
 */
export function mergePolicy(orgPolicy: Readonly<Policy>, override?: Readonly<Partial<Policy>> | null): Policy {
  if (!override) return orgPolicy as Policy;
  let merged: Policy | undefined;
  for (const key of POLICY_KEYS) {
    const value = override[key];
    if (value === undefined || value === orgPolicy[key]) continue;
    merged ??= { ...orgPolicy };
    merged[key] = value;
  }
  return merged ?? (orgPolicy as Policy);
}
