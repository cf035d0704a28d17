import { describe, expect, it } from 'vitest';
import { evaluate, plateTechnique, resultsOf, tubeTechnique } from './techniques';
import { TechniqueSchema } from '../../../shared/schemas/technique';

// Rule 7 (docs/domain-rules.md, common practice, no single source): conductivity within ±15 % (policy); a notch per
// orientation at the flaw's location; notch depth ≤ the flaw's own through-wall extent.

function conductivityResult(output: ReturnType<typeof evaluate>) {
  return resultsOf(output, 'reference-standard').filter((result) => result.flaw === undefined);
}
function notchResult(output: ReturnType<typeof evaluate>, flaw: string) {
  return resultsOf(output, 'reference-standard').filter((result) => result.flaw === flaw);
}

describe('reference-standard', () => {
  it('passes a standard within 15 % of the part and fails one 20 % off', () => {
    expect(conductivityResult(evaluate(plateTechnique({ reference: { conductivityIacs: 28 } })))[0].status).toBe('pass'); // −12.5 %
    const off = conductivityResult(evaluate(plateTechnique({ reference: { conductivityIacs: 38.4 } })))[0]; // +20 %
    expect(off.status).toBe('fail');
    expect(off.message).toMatch(/between 27\.2 and 36\.8 %IACS/);
  });

  it('takes the tolerance from the policy', () => {
    const output = evaluate(plateTechnique({ reference: { conductivityIacs: 28 } }), { policy: { referenceConductivityTolerancePercent: 10 } });
    expect(conductivityResult(output)[0].status).toBe('fail');
  });

  it('fails a flaw orientation with no matching notch', () => {
    const output = evaluate(plateTechnique({ reference: { notches: [{ orientation: 'longitudinal', depthMm: 0.5, lengthMm: 5 }] } }));
    const [result] = notchResult(output, 'crack');
    expect(result.status).toBe('fail');
    expect(result.message).toMatch(/no notch matching/);
  });

  it('fails a notch deeper than the flaw it stands for', () => {
    const output = evaluate(plateTechnique({ reference: { notches: [{ orientation: 'transverse', depthMm: 0.8, lengthMm: 5 }] } }));
    const [result] = notchResult(output, 'crack');
    expect(result.status).toBe('fail');
    expect(result.message).toMatch(/deeper than the flaw/);
  });

  it('matches by plane: a circumferential notch stands for a transverse crack, an angled notch for a crack within 10°', () => {
    const output = evaluate(
      plateTechnique({
        flaws: [
          { id: 'crack', orientation: 'transverse', location: 'surface', depthMm: 0.5, lengthMm: 5 },
          { id: 'oblique', orientation: 'longitudinal', angleDeg: 30, location: 'surface', depthMm: 0.5, lengthMm: 5 },
        ],
        reference: {
          notches: [
            { orientation: 'circumferential', depthMm: 0.5, lengthMm: 5 },
            { orientation: 'longitudinal', angleDeg: 35, depthMm: 0.4, lengthMm: 5 },
          ],
        },
      }),
    );
    expect(notchResult(output, 'crack')[0].status).toBe('pass');
    expect(notchResult(output, 'oblique')[0].status).toBe('pass');
  });

  describe('notch location', () => {
    const farSide = { id: 'far', orientation: 'transverse' as const, location: 'far-side' as const, depthMm: 9, lengthMm: 5 };

    it('does not let a 1 mm notch on the inspected surface represent a far-side flaw', () => {
      // 10 mm plate, far-side crack 9 mm below the inspected surface: 10 − 9 = 1 mm through the wall (geometry).
      const output = evaluate(plateTechnique({ flaws: [farSide], reference: { notches: [{ orientation: 'transverse', depthMm: 1, lengthMm: 5 }] } }));
      const [result] = notchResult(output, 'far');
      expect(result.status).toBe('fail');
      expect(result.message).toMatch(/lies on the far side, but the notch of that orientation sits on the inspected surface/);
      expect(result.message).toMatch(/Add a notch \(transverse\) on the far side no deeper than 1 mm/);
      expect(output.verdict).toBe('does-not-conform');
    });

    it("passes a far-side notch no deeper than the flaw's own through-wall extent, and fails a deeper one", () => {
      const ok = evaluate(plateTechnique({ flaws: [farSide], reference: { notches: [{ orientation: 'transverse', location: 'far-side', depthMm: 1, lengthMm: 5 }] } }));
      expect(notchResult(ok, 'far')[0]).toMatchObject({ status: 'pass', values: { flawThroughWallMm: 1, notchDepthMm: 1 } });
      // The old comparison with depth below the surface (9 mm) would have passed a 3 mm notch; the flaw is 1 mm through the wall.
      const deep = evaluate(plateTechnique({ flaws: [farSide], reference: { notches: [{ orientation: 'transverse', location: 'far-side', depthMm: 3, lengthMm: 5 }] } }));
      expect(notchResult(deep, 'far')[0].status).toBe('fail');
    });

    it('does not let a surface notch represent a flaw 12 mm down; a subsurface notch at that depth or deeper does', () => {
      const buried = { id: 'buried', orientation: 'transverse' as const, location: 'subsurface' as const, depthMm: 12, lengthMm: 5, throughWallMm: 2 };
      const part = { form: 'plate' as const, thicknessMm: 20 };
      const surface = evaluate(plateTechnique({ part, flaws: [buried], reference: { notches: [{ orientation: 'transverse', depthMm: 1, lengthMm: 5 }] } }));
      expect(notchResult(surface, 'buried')[0].status).toBe('fail');
      const shallower = evaluate(plateTechnique({ part, flaws: [buried], reference: { notches: [{ orientation: 'transverse', location: 'subsurface', depthBelowSurfaceMm: 6, depthMm: 2, lengthMm: 5 }] } }));
      expect(notchResult(shallower, 'buried')[0].status).toBe('fail');
      const matched = evaluate(plateTechnique({ part, flaws: [buried], reference: { notches: [{ orientation: 'transverse', location: 'subsurface', depthBelowSurfaceMm: 12, depthMm: 2, lengthMm: 5 }] } }));
      expect(notchResult(matched, 'buried')[0].status).toBe('pass');
    });

    it('warns when a subsurface flaw gives no through-wall extent to compare the notch with', () => {
      const buried = { id: 'buried', orientation: 'transverse' as const, location: 'subsurface' as const, depthMm: 4, lengthMm: 5 };
      const output = evaluate(plateTechnique({ flaws: [buried], reference: { notches: [{ orientation: 'transverse', location: 'subsurface', depthBelowSurfaceMm: 4, depthMm: 1, lengthMm: 5 }] } }));
      expect(notchResult(output, 'buried')[0]).toMatchObject({ status: 'warn' });
      expect(notchResult(output, 'buried')[0].message).toMatch(/through-wall extent/);
    });

    it('passes the tube far-side crack on a far-side notch of the wall left below it', () => {
      // Wall 1.24 mm, crack 1.0 mm below the bore: 0.24 mm through the wall (geometry).
      const output = evaluate(tubeTechnique());
      expect(notchResult(output, 'axial-crack')[0]).toMatchObject({ status: 'pass' });
      expect(notchResult(output, 'axial-crack')[0].values.flawThroughWallMm).toBeCloseTo(0.24, 9);
    });

    it('puts a notch written without a location on the inspected surface, and asks a subsurface notch for its depth', () => {
      const parsed = TechniqueSchema.parse(plateTechnique());
      expect(parsed.reference.notches[0].location).toBe('surface');
      const missing = TechniqueSchema.safeParse(plateTechnique({ reference: { notches: [{ orientation: 'transverse', location: 'subsurface', depthMm: 1, lengthMm: 5 }] } }));
      expect(missing.success).toBe(false);
      expect(missing.error?.issues[0].message).toMatch(/depthBelowSurfaceMm is required for a subsurface notch/);
    });
  });
});
