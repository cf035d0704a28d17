import Complex from 'complex.js';
import { describe, expect, it } from 'vitest';
import { besselJScaled, besselJY, hankelScaled, kelvinBerBei, kelvinKerKei } from '../../../shared/domain/fields/bessel';

// Check values come from outside the code under test: Abramowitz & Stegun's tables, identities
// of A&S chapter 9, Bessel's integral computed here by quadrature, and values computed once with
// scipy 1.17.1 (scipy.special). No general-purpose npm library computes Bessel functions of
// complex argument (mathjs 15 has none; @stdlib's and the `bessel` package's are real only).

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

describe('against general-purpose libraries (computed once: scipy 1.17.1 scipy.special, mpmath 1.3.0)', () => {
  // [z, J0, J1, Y0, Y1] from scipy 1.17.1 (scipy.special.jv / yv), each as [re, im].
  const table: [Complex, [number, number][]][] = [
    [new Complex(3, -4), [[-8.812143793697905, 4.598437899743034], [3.654110281414263, 8.403104256583088], [4.6047596915010125, 8.811077140823224], [8.404608446176784, -3.6473524391213576]]],
    [new Complex(7.7, -7.7), [[141.9045226522711, 228.69262833696365], [226.05300428479066, -129.6278323934555], [228.69265321242386, -141.90441693252401], [-129.62794075661265, -226.0529752749793]]],
    [new Complex(12, -12), [[9028.049951029607, -13019.715144425685], [-12556.57597156887, -9117.279020719421], [-13019.715145590697, -9028.049951240006], [-9117.27902052843, 12556.575970375308]]],
    [new Complex(20, 5), [[11.573058161513323, -6.048023313832591], [6.288123818649647, 11.36386341868036], [6.048300582134626, 11.571908973252363], [-11.365013170631222, 6.287817980630435]]],
    [new Complex(-4, 2), [[-1.3787022343924844, -0.3905423570667095], [0.5073525508045522, -1.2263041391310046], [0.3996257860226193, -1.4282395814360993], [1.1732982229552469, 0.5025009042928297]]],
    [new Complex(-6, -9), [[828.0057538296737, 547.4028053297884], [504.0054748957725, -810.4804134003539], [547.4027756709612, -828.005753973617], [-810.4804125171071, -504.0055056792461]]],
    [new Complex(50, -50), [[1.9464557274457106e20, -1.508921029751129e20], [-1.4915953875546276e20, -1.9443066560913808e20], [-1.508921029751129e20, -1.946455727445711e20], [-1.9443066560913808e20, 1.4915953875546276e20]]],
  ];
  it.each(table.map(([z, values]) => [z.toString(), z, values] as const))('J0, J1, Y0, Y1 at %s', (_, z, values) => {
    const { j0, j1, y0, y1 } = besselJY(z);
    [j0, j1, y0, y1].forEach((got, i) => {
      expect(relativeError(got, new Complex(values[i][0], values[i][1]))).toBeLessThan(1e-8);
    });
  });

  it('scaled Hankel functions at 500 − 500i (scipy hankel1e, hankel2e)', () => {
    const { first, second } = hankelScaled(new Complex(500, -500));
    expect(relativeError(first.order0, new Complex(0.027723284402678704, -0.01148742464899412))).toBeLessThan(1e-10);
    expect(relativeError(first.order1, new Complex(-0.011467812359597254, -0.02771516935448239))).toBeLessThan(1e-10);
    expect(relativeError(second.order0, new Complex(0.011477623700122392, 0.02771922473018799))).toBeLessThan(1e-10);
    expect(relativeError(second.order1, new Complex(-0.02772734839033136, 0.011497215198600667))).toBeLessThan(1e-10);
  });

  it('Kelvin functions at x = 3, 4 and 10 (mpmath 1.3.0 at 30 digits: ber, bei, ker, kei)', () => {
    // mpmath rather than scipy here: scipy 1.17.1's ber(10) = 138.84046601 is itself 5e−10 off mpmath's 138.84046594.
    const table = [
      { x: 3, ber: -0.22138024959869389, bei: 1.9375867852660428, ker: -0.067029233303798698, kei: -0.051121884045986781 },
      { x: 4, ber: -2.5634165572585798, bei: 2.2926903226992998, ker: -0.036178847899547611, kei: 0.0021983992949725199 },
      { x: 10, ber: 138.84046594163265, bei: 56.370458553906638, ker: 0.00012946633021480612, kei: -0.0003075245690881442 },
    ];
    for (const { x, ber, bei, ker, kei } of table) {
      const first = kelvinBerBei(x);
      const second = kelvinKerKei(x);
      expect(Math.abs(first.ber - ber)).toBeLessThan(1e-12 * Math.abs(ber));
      expect(Math.abs(first.bei - bei)).toBeLessThan(1e-12 * Math.abs(bei));
      // ker, kei decay like e^(−x/√2) and are formed from growing functions below |z| = 11: the documented ≲ 1e−9.
      expect(Math.abs(second.ker - ker)).toBeLessThan(2e-9 * Math.abs(ker));
      expect(Math.abs(second.kei - kei)).toBeLessThan(2e-9 * Math.abs(kei));
    }
  });
});
