import { describe, expect, it } from 'vitest';
import { evaluate, plateTechnique, resultOf, tubeTechnique } from './techniques';

// Rule 4 (DOMAIN.md): edge zone 2 coil diameters unshielded, 0.5 shielded ([mem], policy);
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
    // Unshielded 5 mm: zone 10 mm; shielded: 2.5 mm. The scan keeps 3 mm from the edge.
    const shielded = evaluate(plateTechnique({ scan: { indexMm: 2, minEdgeDistanceMm: 3 } }));
    expect(resultOf(shielded, 'edge-effect')).toMatchObject({ status: 'pass', values: { edgeZoneMm: 2.5 } });
    const farAway = evaluate(plateTechnique({ coils: unshieldedCoil, scan: { indexMm: 2, minEdgeDistanceMm: 10 } }));
    expect(resultOf(farAway, 'edge-effect').status).toBe('pass');
  });

  it('takes the edge zone from the policy', () => {
    const output = evaluate(plateTechnique({ scan: { indexMm: 2, minEdgeDistanceMm: 3 } }), { policy: { edgeZoneShieldedDiameters: 1 } });
    expect(resultOf(output, 'edge-effect').status).toBe('fail');
  });

  it('does not apply when the scan area has no edge, or to a bobbin coil', () => {
    expect(resultOf(evaluate(plateTechnique()), 'edge-effect').status).toBe('not_applicable');
    expect(resultOf(evaluate(tubeTechnique({ scan: { minEdgeDistanceMm: 1 } })), 'edge-effect').status).toBe('not_applicable');
  });
});
