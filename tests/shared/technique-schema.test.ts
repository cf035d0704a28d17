import { describe, expect, it } from 'vitest';
import { evaluateTechnique, parseTechnique, safeEvaluateTechnique, formatIssues } from '../../shared/domain/checklist/index';
import { TechniqueSchema } from '../../shared/schemas/technique';
import { barTechnique, plateTechnique, tubeTechnique } from './checklist/techniques';
import { ZodError } from 'zod';

function issues(input: unknown) {
  const result = parseTechnique(input);
  if (result.success) throw new Error('expected invalid input');
  return result.issues;
}

describe('TechniqueSchema', () => {
  it('applies defaults: μr 1, not saturated, unshielded, no edge guide', () => {
    const technique = TechniqueSchema.parse(barTechnique());
    expect(technique.material).toMatchObject({ relativePermeability: 1, saturated: false });
    expect(technique.coils[0].shielded).toBe(false);
    expect(technique.scan.edgeGuide).toBe(false);
  });

  it('names the field and what is wrong', () => {
    const bad = plateTechnique();
    bad.material.conductivityIacs = -3;
    const [issue] = issues(bad);
    expect(issue.path).toBe('material.conductivityIacs');
    expect(issue.message).toMatch(/conductivityIacs .*must be greater than 0 %IACS/);
  });

  it('reports a missing required field by name', () => {
    const { coils: _coils, ...rest } = plateTechnique();
    expect(issues(rest)).toEqual([expect.objectContaining({ path: 'coils', message: expect.stringMatching(/coils is required/) })]);
  });

  it('rejects unknown fields instead of dropping them', () => {
    const bad = { ...plateTechnique(), colour: 'blue' };
    expect(issues(bad)[0].message).toMatch(/Unknown field "colour"/);
    const badCoil = plateTechnique();
    (badCoil.coils[0] as Record<string, unknown>).frequencyHz = 100;
    expect(issues(badCoil)[0]).toMatchObject({ path: 'coils[0]', message: expect.stringMatching(/Unknown field "frequencyHz"/) });
  });

  it('requires what each part form needs', () => {
    expect(issues(plateTechnique({ part: { form: 'plate' } }))[0]).toMatchObject({ path: 'part.thicknessMm', message: expect.stringMatching(/required for a plate/) });
    expect(issues(barTechnique({ part: { form: 'bar' } }))[0].path).toBe('part.diameterMm');
    expect(issues(tubeTechnique({ part: { form: 'tube', diameterMm: 19 } }))[0].path).toBe('part.wallMm');
    expect(issues(tubeTechnique({ part: { form: 'tube', diameterMm: 19, wallMm: 10 } }))[0].message).toMatch(/less than half/);
    expect(issues(tubeTechnique({ part: { form: 'bore' } }))[0].path).toBe('part.diameterMm');
  });

  it('rejects a coil that cannot fit the part form', () => {
    expect(issues(plateTechnique({ coils: [{ type: 'encircling', diameterMm: 22, mode: 'absolute', frequenciesHz: [500] }] }))[0]).toMatchObject({
      path: 'coils[0].type',
      message: expect.stringMatching(/needs a bar or tube/),
    });
    expect(issues(barTechnique({ coils: [{ type: 'bobbin', diameterMm: 10, mode: 'absolute', frequenciesHz: [500] }] }))[0].message).toMatch(/needs a tube or bore/);
  });

  it('rejects flaws deeper than the part, duplicate ids, and a metal-above thickness on a surface flaw', () => {
    expect(issues(plateTechnique({ flaws: [{ id: 'a', orientation: 'transverse', location: 'far-side', depthMm: 11, lengthMm: 5 }] }))[0].message).toMatch(/deeper than the part/);
    const crack = { id: 'a', orientation: 'transverse' as const, location: 'surface' as const, depthMm: 0.5, lengthMm: 5 };
    expect(issues(plateTechnique({ flaws: [crack, crack] }))[0]).toMatchObject({ path: 'flaws[1].id', message: expect.stringMatching(/unique/) });
    expect(issues(plateTechnique({ flaws: [{ ...crack, metalAboveMm: 0.2 }] }))[0].path).toBe('flaws[0].metalAboveMm');
  });

  it('rejects bad enum values and lists the allowed ones', () => {
    const bad = plateTechnique();
    (bad.coils[0] as Record<string, unknown>).type = 'spiral';
    expect(issues(bad)[0].message).toMatch(/one of surface, pencil, rotating, encircling, bobbin, multidirectional/);
  });

  it('rejects non-finite numbers', () => {
    const bad = plateTechnique();
    bad.coils[0].frequenciesHz = [Number.POSITIVE_INFINITY];
    expect(issues(bad)[0].path).toBe('coils[0].frequenciesHz[0]');
  });

  it('rejects a bad policy override naming the setting', () => {
    const found = issues({ ...plateTechnique(), policy: { penetrationDepthFactor: 0 } });
    expect(found[0]).toMatchObject({ path: 'policy.penetrationDepthFactor' });
  });

  it('makes evaluateTechnique throw the ZodError and safeEvaluateTechnique return the issues', () => {
    expect(() => evaluateTechnique({})).toThrow(ZodError);
    const result = safeEvaluateTechnique({ code: 'X' });
    expect(result.success).toBe(false);
    if (!result.success) expect(formatIssues(result.issues)).toContain('title: title (technique title) is required');
  });
});
