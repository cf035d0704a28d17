import Complex from 'complex.js';
import { describe, expect, it } from 'vitest';
import { besselJScaled, besselJY, hankelScaled, kelvinBerBei, kelvinKerKei } from '../../../shared/domain/fields/bessel';

// Check values come from outside the code under test: Abramowitz & Stegun's tables, identities
// of A&S chapter 9, and Bessel's integral computed here by quadrature. No general-purpose npm
// library computes Bessel functions of complex argument (mathjs 15 has none; @stdlib's are real),
// so library values are not used.

/** Bessel's integral J_n(z) = (1/π)∫0^π cos(nτ − z sin τ) dτ (A&S 9.1.21), by the trapezoid rule (exponentially accurate for this periodic integrand). */
function besselIntegral(order: number, z: Complex): Complex {
  const steps = 4000;
  let sum = Complex.ZERO;
  for (let i = 0; i <= steps; i++) {
    const tau = (Math.PI * i) / steps;
    const weight = i === 0 || i === steps ? 0.5 : 1;
    sum = sum.add(z.mul(-Math.sin(tau)).add(order * tau).cos().mul(weight));
  }
  return sum.div(steps);
}

const relativeError = (got: Complex, want: Complex) => got.sub(want).abs() / want.abs();

describe('Kelvin functions against A&S Table 9.12', () => {
  // A&S Table 9.12 (ber, bei, ker, kei), from memory; the same values follow from the series 9.9.10.
  const table = [
    { x: 1, ber: 0.98438178, bei: 0.24956604, ker: 0.28670621, kei: -0.49499464 },
    { x: 2, ber: 0.75173418, bei: 0.97229163, ker: -0.04166451, kei: -0.20240007 },
    { x: 5, ber: -6.23008250, bei: 0.11603444, ker: -0.01151173, kei: 0.01118759 },
  ];
  it.each(table)('ber, bei, ker, kei at x = $x', ({ x, ber, bei, ker, kei }) => {
    const first = kelvinBerBei(x);
    const second = kelvinKerKei(x);
    expect(first.ber).toBeCloseTo(ber, 6);
    expect(first.bei).toBeCloseTo(bei, 6);
    expect(second.ker).toBeCloseTo(ker, 6);
    expect(second.kei).toBeCloseTo(kei, 6);
  });
});

describe('J0, J1, Y0, Y1 of real argument', () => {
  // A&S Table 9.1 (from memory): J0(1) = 0.7651976866, J1(1) = 0.4400505857, Y0(1) = 0.0882569642, Y1(1) = −0.7812128213.
  it('matches A&S Table 9.1 at x = 1', () => {
    const { j0, j1, y0, y1 } = besselJY(new Complex(1, 0));
    expect(j0.re).toBeCloseTo(0.7651976866, 9);
    expect(j1.re).toBeCloseTo(0.4400505857, 9);
    expect(y0.re).toBeCloseTo(0.0882569642, 9);
    expect(y1.re).toBeCloseTo(-0.7812128213, 9);
  });
});

describe('complex argument: Bessel integral and Wronskian', () => {
  // Arguments on both sides of the switch from series to asymptotic expansion (|z| = 11), on
  // the ray (1−i)x the field models use, and off it (left half-plane: the reflection formulas).
  const points = [new Complex(3, -4), new Complex(7.7, -7.7), new Complex(7.8, -7.8), new Complex(12, -12), new Complex(20, 5), new Complex(30, 0), new Complex(-4, 2), new Complex(-6, -9)];

  it.each(points.map((z) => [z.toString(), z] as const))('J0 and J1 at %s equal Bessel\'s integral (A&S 9.1.21)', (_, z) => {
    const { j0, j1 } = besselJY(z);
    expect(relativeError(j0, besselIntegral(0, z))).toBeLessThan(1e-8);
    expect(relativeError(j1, besselIntegral(1, z))).toBeLessThan(1e-8);
  });

  it.each(points.map((z) => [z.toString(), z] as const))('J1·Y0 − J0·Y1 = 2/(πz) at %s (A&S 9.1.16)', (_, z) => {
    const { j0, j1, y0, y1 } = besselJY(z);
    const wronskian = j1.mul(y0).sub(j0.mul(y1));
    // J and Y grow like e^|Im z|, so the difference of their products loses e^(2|Im z|) in
    // double precision, whatever the method; the models use the scaled forms below.
    const tolerance = Math.max(1e-10, 1e-15 * Math.exp(2 * Math.abs(z.im)));
    expect(relativeError(wronskian, new Complex(2 / Math.PI, 0).div(z))).toBeLessThan(tolerance);
  });

  it('scaled Hankel functions keep H⁽¹⁾_1·H⁽²⁾_0 − H⁽¹⁾_0·H⁽²⁾_1 = −4i/(πz) far beyond overflow (A&S 9.1.17)', () => {
    for (const x of [0.5, 5, 50, 500, 5000]) {
      const z = new Complex(x, -x);
      const { first, second } = hankelScaled(z);
      const wronskian = first.order1.mul(second.order0).sub(first.order0.mul(second.order1));
      expect(relativeError(wronskian, new Complex(0, -4 / Math.PI).div(z))).toBeLessThan(1e-9);
    }
  });

  it('scaled J stays finite where J itself overflows, with J1/J0 → −i on the ray (1−i)x (A&S 9.2.1)', () => {
    const z = new Complex(2000, -2000);
    const { order0, order1 } = besselJScaled(z);
    expect(Number.isFinite(order0.abs()) && order0.abs() > 0).toBe(true);
    const ratio = order1.div(order0);
    // Two terms of the asymptotic ratio: −i + 1/(2z).
    expect(relativeError(ratio, new Complex(0, -1).add(new Complex(0.5, 0).div(z)))).toBeLessThan(1e-6);
  });

  it('scaled J equals J·e^(−|Im z|) where both are finite', () => {
    for (const z of [new Complex(4, -4), new Complex(15, -15), new Complex(40, -3)]) {
      const scaled = besselJScaled(z);
      const factor = Math.exp(-Math.abs(z.im));
      expect(relativeError(scaled.order0, besselIntegral(0, z).mul(factor))).toBeLessThan(1e-8);
      expect(relativeError(scaled.order1, besselIntegral(1, z).mul(factor))).toBeLessThan(1e-8);
    }
  });
});
