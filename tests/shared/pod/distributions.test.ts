import jstat from 'jstat';
import { describe, expect, it } from 'vitest';
import { betaQuantile, chiSquareQuantile, logNormalCdf, millsRatio, normalCdf, normalQuantile } from '../../../shared/domain/pod/distributions';

const { jStat } = jstat;

describe('distribution functions', () => {
  it('when asked for standard quantiles, then they match the published tables', () => {
    // Standard normal and χ² tables (e.g. Abramowitz & Stegun, tables 26.1 and 26.8), 10 decimals.
    expect(normalQuantile(0.9)).toBeCloseTo(1.2815515655, 10);
    expect(normalQuantile(0.95)).toBeCloseTo(1.644853627, 9);
    expect(normalQuantile(0.975)).toBeCloseTo(1.959963985, 9);
    expect(chiSquareQuantile(0.9, 1)).toBeCloseTo(2.7055434541, 9);
    expect(chiSquareQuantile(0.95, 1)).toBeCloseTo(3.8414588207, 9);
    expect(normalCdf(1.96)).toBeCloseTo(0.9750021049, 10);
  });

  it('when compared with jstat 1.9.6 over a range, then they agree to 1e-8 (the beta inverse of jstat is the less exact)', () => {
    for (let p = 0.01; p < 1; p += 0.07) {
      expect(normalQuantile(p)).toBeCloseTo(jStat.normal.inv(p, 0, 1), 9);
      expect(chiSquareQuantile(p, 1)).toBeCloseTo(jStat.chisquare.inv(p, 1), 7);
      expect(betaQuantile(p, 45, 2)).toBeCloseTo(jStat.beta.inv(p, 45, 2), 8);
    }
    for (let z = -6; z <= 6; z += 0.5) expect(normalCdf(z)).toBeCloseTo(jStat.normal.cdf(z, 0, 1), 12);
  });

  it('when z is far in the lower tail, then ln Φ and φ/Φ stay finite and continuous at the switch to the asymptotic series', () => {
    expect(millsRatio(-37 - 1e-9)).toBeCloseTo(millsRatio(-37 + 1e-9), 8);
    expect(logNormalCdf(-37 - 1e-9)).toBeCloseTo(logNormalCdf(-37 + 1e-9), 6);
    expect(Number.isFinite(logNormalCdf(-200))).toBe(true);
    // φ(z)/Φ(z) → −z as z → −∞ (Mills' ratio, a textbook limit).
    expect(millsRatio(-200) / 200).toBeCloseTo(1, 4);
  });
});
