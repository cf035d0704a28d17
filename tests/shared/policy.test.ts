import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY, mergePolicy, POLICY_SETTINGS, PolicyOverrideSchema, PolicySchema } from '../../shared/domain/policy';
import { evaluateTechnique } from '../../shared/domain/checklist/index';
import { plateTechnique } from './checklist/techniques';

describe('policy', () => {
  it('holds the defaults docs/domain.md gives', () => {
    // docs/domain.md: product default 0.5; [trade] 0.5, k = 3, 0.7 / 0.8, ±15 %; [mem] 2 / 0.5 diameters, 5–15, 5 years;
    // [pub ISO 9712] 12 months; [pub military manual] short crack 0.5; [trade] due periods 30 / 1 / 90 days.
    expect(DEFAULT_POLICY).toMatchObject({
      orientationSensitivityMin: 0.5,
      scanIndexFractionMax: 0.5,
      shortCrackFraction: 0.5,
      penetrationDepthFactor: 3,
      edgeZoneUnshieldedDiameters: 2,
      edgeZoneShieldedDiameters: 0.5,
      fillFactorMinEncircling: 0.7,
      fillFactorMinInternal: 0.8,
      limitFrequencyRatioMin: 5,
      limitFrequencyRatioMax: 15,
      referenceConductivityTolerancePercent: 15,
      certificateValidityYears: 5,
      nearVisionExamMonths: 12,
      findingDueDaysMajor: 30,
      findingContainmentDays: 1,
      findingDueDaysMinor: 90,
    });
  });

  it('describes every setting with a label, unit and basis, and the defaults validate', () => {
    for (const setting of POLICY_SETTINGS) {
      expect(setting.label.length, setting.key).toBeGreaterThan(5);
      expect(setting.basis.length, setting.key).toBeGreaterThan(5);
      expect(typeof setting.unit).toBe('string');
      expect(setting.defaultValue).toBeGreaterThanOrEqual(setting.min);
      expect(setting.defaultValue).toBeLessThanOrEqual(setting.max);
    }
    expect(PolicySchema.safeParse(DEFAULT_POLICY).success).toBe(true);
    expect(Object.keys(DEFAULT_POLICY).sort()).toEqual(POLICY_SETTINGS.map((setting) => setting.key).sort());
  });

  it('rejects out-of-range or unknown settings in an override', () => {
    expect(PolicyOverrideSchema.safeParse({ fillFactorMinInternal: 1.5 }).success).toBe(false);
    const unknown = PolicyOverrideSchema.safeParse({ fillFactor: 0.5 });
    expect(unknown.success).toBe(false);
    if (!unknown.success) expect(unknown.error.issues[0].message).toMatch(/Unknown policy setting "fillFactor"/);
    expect(PolicySchema.safeParse({ ...DEFAULT_POLICY, limitFrequencyRatioMin: 20 }).success).toBe(false);
  });

  it('merges an override over the organisation policy without changing either', () => {
    const org = { ...DEFAULT_POLICY, fillFactorMinEncircling: 0.75 };
    const merged = mergePolicy(org, { fillFactorMinInternal: 0.85, scanIndexFractionMax: undefined });
    expect(merged).toMatchObject({ fillFactorMinEncircling: 0.75, fillFactorMinInternal: 0.85, scanIndexFractionMax: 0.5 });
    expect(org.fillFactorMinInternal).toBe(0.8);
    expect(mergePolicy(org, undefined)).toBe(org);
    expect(mergePolicy(org, {})).toBe(org);
  });

  it('applies the technique override over the organisation policy in the engine, and reports the policy used', () => {
    const output = evaluateTechnique({ ...plateTechnique(), policy: { scanIndexFractionMax: 0.4 } }, { policy: { scanIndexFractionMax: 0.3, penetrationDepthFactor: 2 } });
    expect(output.policy.scanIndexFractionMax).toBe(0.4);
    expect(output.policy.penetrationDepthFactor).toBe(2);
  });
});
