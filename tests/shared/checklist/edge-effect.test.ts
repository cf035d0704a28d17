import { describe, expect, it } from 'vitest';
import { evaluate, plateTechnique, resultOf, tubeTechnique } from './techniques';

// Rule 4 (docs/domain-rules.md): edge zone 2 coil diameters unshielded, 0.5 shielded (from memory, policy),
// measured beyond the winding: the coil centre must stay radius + zone from the edge (geometry);
// pass inside it only with a guide AND a reference notch at the same edge distance.

const unshieldedCoil = [{ type: 'surface' as const, diameterMm: 5, shielded: false, mode: 'absolute' as const, frequenciesHz: [100_000] }];
const crackNotch = { orientation: 'transverse' as const, depthMm: 0.5, lengthMm: 5 };

describe('edge-effect', () => {
  it('fails an unguided scan near an edge and suggests a shielded probe or a higher frequency', () => {
    const output = evaluate(plateTechnique({ coils: unshieldedCoil, scan: { indexMm: 2, minEdgeDistanceMm: 3 } }));
    const result = resultOf(output, 'edge-effect');
    expect(result.status).toBe('fail');
    expect(result.values.edgeZoneMm).toBe(10); // 2 × 5 mm
    expect(result.message).toMatch(/guide or fixture/);
    expect(result.message).toMatch(/reference notch at 3 mm/);
    expect(result.message).toMatch(/shielded probe/);
    expect(result.message).toMatch(/higher frequency/);
    expect(output.verdict).toBe('does-not-conform');
  });

  it('passes the same scan with a guide and a notch at the same edge distance', () => {
    const output = evaluate(
      plateTechnique({
        coils: unshieldedCoil,
        scan: { indexMm: 2, minEdgeDistanceMm: 3, edgeGuide: true },
        reference: { notches: [{ ...crackNotch, edgeDistanceMm: 3 }] },
      }),
    );
    expect(resultOf(output, 'edge-effect').status).toBe('pass');
    expect(output.verdict).toBe('conforms');
  });

  it('fails with a guide but no notch at that edge distance', () => {
    const output = evaluate(
      plateTechnique({
        coils: unshieldedCoil,
        scan: { indexMm: 2, minEdgeDistanceMm: 3, edgeGuide: true },
        reference: { notches: [{ ...crackNotch, edgeDistanceMm: 6 }] },
      }),
    );
    const result = resultOf(output, 'edge-effect');
    expect(result.status).toBe('fail');
    expect(result.message).not.toMatch(/guide or fixture holding/);
  });

  it('fails with an edge notch but no guide', () => {
    const output = evaluate(
      plateTechnique({
        coils: unshieldedCoil,
        scan: { indexMm: 2, minEdgeDistanceMm: 3 },
        reference: { notches: [{ ...crackNotch, edgeDistanceMm: 3 }] },
      }),
    );
    expect(resultOf(output, 'edge-effect').status).toBe('fail');
  });

  it('passes outside the edge zone, which is smaller for a shielded coil', () => {
    // Shielded 5 mm: zone 0.5 × 5 = 2.5 mm beyond the winding, so the centre needs 2.5 + 2.5 = 5 mm.
    const shielded = evaluate(plateTechnique({ scan: { indexMm: 2, minEdgeDistanceMm: 5 } }));
    expect(resultOf(shielded, 'edge-effect')).toMatchObject({ status: 'pass', values: { edgeZoneMm: 2.5, clearCentreDistanceMm: 5 } });
    // Unshielded 5 mm: zone 10 mm beyond the winding, so the centre needs 2.5 + 10 = 12.5 mm.
    const farAway = evaluate(plateTechnique({ coils: unshieldedCoil, scan: { indexMm: 2, minEdgeDistanceMm: 12.5 } }));
    expect(resultOf(farAway, 'edge-effect')).toMatchObject({ status: 'pass', values: { clearCentreDistanceMm: 12.5 } });
  });

  it('does not put the winding at the edge: a shielded coil 0.5 D from the edge is inside its zone', () => {
    // Before the fix the zone was measured from the centre: 2.5 mm passed, with the winding (radius 2.5 mm) on the edge.
    const atWinding = resultOf(evaluate(plateTechnique({ scan: { indexMm: 2, minEdgeDistanceMm: 2.5 } })), 'edge-effect');
    expect(atWinding.status).toBe('fail');
    expect(atWinding.message).toMatch(/its centre must stay 5 mm from an edge \(radius 2\.5 mm \+ 2\.5 mm\)/);
    expect(atWinding.message).toMatch(/keep the coil centre at least 5 mm from the edge/);
    const overhanging = resultOf(evaluate(plateTechnique({ scan: { indexMm: 2, minEdgeDistanceMm: 1 } })), 'edge-effect');
    expect(overhanging.message).toMatch(/winding itself overhangs the edge/);
  });

  it('takes the edge zone from the policy', () => {
    // Shielded 5 mm clears at 5 mm with the default 0.5 D zone, not with a 1 D zone (centre needs 7.5 mm).
    const output = evaluate(plateTechnique({ scan: { indexMm: 2, minEdgeDistanceMm: 5 } }), { policy: { edgeZoneShieldedDiameters: 1 } });
    expect(resultOf(output, 'edge-effect').status).toBe('fail');
  });

  it('does not apply when the scan area has no edge, or to a bobbin coil', () => {
    expect(resultOf(evaluate(plateTechnique()), 'edge-effect').status).toBe('not_applicable');
    expect(resultOf(evaluate(tubeTechnique({ scan: { minEdgeDistanceMm: 1 } })), 'edge-effect').status).toBe('not_applicable');
  });
});
