import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ceilSig, floorSig, hz, mm, sig } from '../../../shared/domain/checklist/format';

// The engine formats numbers itself for speed; JavaScript's own toPrecision is the reference.
describe('message number formatting', () => {
  it('writes the same text as toPrecision for two and three significant figures', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constantFrom(2, 3), (value, digits) => {
        expect(sig(value, digits)).toBe(String(Number(value.toPrecision(digits))));
      }),
      { numRuns: 5000 },
    );
    for (const value of [0.6244, 999.6, 0.00099996, 160_000, 1e-7, 12.5, -3.14159]) expect(sig(value)).toBe(String(Number(value.toPrecision(3))));
  });

  it('rounds suggestions towards the safe side', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1e12, noNaN: true }), (value) => {
        const down = floorSig(value);
        const up = ceilSig(value);
        expect(down).toBeLessThanOrEqual(value * (1 + 1e-12));
        expect(up).toBeGreaterThanOrEqual(value * (1 - 1e-12));
        expect(Number(down.toPrecision(3))).toBe(down);
        expect(down / value).toBeGreaterThan(0.99 - 1e-9);
      }),
      { numRuns: 5000 },
    );
    expect(floorSig(30_719)).toBe(30_700);
    expect(ceilSig(14.82)).toBe(14.9);
  });

  it('spells units out', () => {
    expect(mm(0.62445)).toBe('0.624 mm');
    expect(hz(87.3)).toBe('87.3 Hz');
    expect(hz(3412)).toBe('3.41 kHz');
    expect(hz(2_000_000)).toBe('2 MHz');
  });
});
