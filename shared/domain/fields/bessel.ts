// Bessel functions of order 0 and 1 for complex argument, and the Kelvin functions.
//
// No well-kept npm package computes J/Y/H of complex argument (the general-purpose
// ones, @stdlib and the `bessel` package, take real arguments only; mathjs has none), so they are
// written here. Method (see docs/domain-long-coils.md):
//   |z| ≤ 11: the ascending series (A&S 9.1.10 for J, 9.1.11/9.1.13 for Y);
//   |z| > 11: Hankel's asymptotic expansion (A&S 9.2.7–9.2.10), summed until the
//             terms stop falling; left half-plane by the reflection formulas
//             J_n(−z) = (−1)^n J_n(z), Y_n(ze^{±iπ}) = (−1)^n [Y_n(z) ± 2i J_n(z)] (A&S 9.1.35–36).
// Accuracy: the asymptotic series' smallest term near |z| = 11 is about e^(−22) ≈ 3e−10
// of the leading term, and the series loses at most e^(2|Im z|)·1e−16 ≈ 1e−9 when a
// decaying Hankel function is formed from growing J and Y there: relative error ≲ 1e−9
// everywhere, ≲ 1e−13 away from |z| ≈ 11 (checked in the tests against A&S Table 9.12,
// the Wronskians, Bessel's integral, and values from scipy 1.17.1 and mpmath 1.3.0).
//
// Large arguments: the field models meet z = (1−i)r/δ with |z| in the thousands, where
// J and Y overflow (they grow like e^|Im z|). `hankelScaled` returns H⁽¹⁾(z)e^(−iz) and
// H⁽²⁾(z)e^(iz), which stay of order |z|^(−1/2), so the models work with ratios and never
// form the exponentials themselves.
import Complex from 'complex.js';

export interface BesselPair {
  /** Order 0. */
  order0: Complex;
  /** Order 1. */
  order1: Complex;
}

/** H⁽¹⁾_n(z)·e^(−iz) and H⁽²⁾_n(z)·e^(iz), n = 0, 1: bounded for every z off the origin. */
export interface ScaledHankel {
  first: BesselPair;
  second: BesselPair;
}

const SERIES_RADIUS = 11;
const EULER_GAMMA = 0.5772156649015329;
const TWO_OVER_PI = 2 / Math.PI;
const I = new Complex(0, 1);

// ---------------------------------------------------------------- series

interface JY {
  j0: Complex;
  j1: Complex;
  y0: Complex;
  y1: Complex;
}

/** Ascending series for J0, J1, Y0, Y1 (z ≠ 0 for Y). Inner loop on plain numbers (speed). */
function seriesJY(z: Complex): JY {
  // q = −z²/4
  const qRe = -(z.re * z.re - z.im * z.im) / 4;
  const qIm = -(2 * z.re * z.im) / 4;
  let t0Re = 1; // (−z²/4)^k/(k!)²
  let t0Im = 0;
  let t1Re = 1; // (−z²/4)^k/(k!(k+1)!)
  let t1Im = 0;
  let j0Re = 1;
  let j0Im = 0;
  let s1Re = 1;
  let s1Im = 0;
  let y0Re = 0; // Σ_{k≥1} −H_k (−z²/4)^k/(k!)²
  let y0Im = 0;
  let y1Re = 1 - 2 * EULER_GAMMA; // Σ_{k≥0} (ψ(k+1)+ψ(k+2)) (−z²/4)^k/(k!(k+1)!)
  let y1Im = 0;
  let harmonic = 0;
  for (let k = 1; k < 300; k++) {
    let re = (t0Re * qRe - t0Im * qIm) / (k * k);
    t0Im = (t0Re * qIm + t0Im * qRe) / (k * k);
    t0Re = re;
    re = (t1Re * qRe - t1Im * qIm) / (k * (k + 1));
    t1Im = (t1Re * qIm + t1Im * qRe) / (k * (k + 1));
    t1Re = re;
    harmonic += 1 / k;
    j0Re += t0Re;
    j0Im += t0Im;
    s1Re += t1Re;
    s1Im += t1Im;
    y0Re -= t0Re * harmonic;
    y0Im -= t0Im * harmonic;
    // ψ(k+1) + ψ(k+2) = −2γ + H_k + H_{k+1}
    const psi = -2 * EULER_GAMMA + 2 * harmonic + 1 / (k + 1);
    y1Re += t1Re * psi;
    y1Im += t1Im * psi;
    const small = 1e-17;
    if (k > 2 && Math.abs(t0Re) + Math.abs(t0Im) < small * (Math.abs(j0Re) + Math.abs(j0Im)) && Math.abs(t1Re) + Math.abs(t1Im) < small * (Math.abs(s1Re) + Math.abs(s1Im))) break;
  }
  const j0 = new Complex(j0Re, j0Im);
  const half = z.mul(0.5);
  const j1 = half.mul(new Complex(s1Re, s1Im));
  const logHalf = half.log();
  const y0 = logHalf.add(EULER_GAMMA).mul(j0).add(new Complex(y0Re, y0Im)).mul(TWO_OVER_PI);
  const y1 = new Complex(-TWO_OVER_PI, 0)
    .div(z)
    .add(logHalf.mul(j1).mul(TWO_OVER_PI))
    .sub(half.mul(new Complex(y1Re, y1Im)).div(Math.PI));
  return { j0, j1, y0, y1 };
}

// ---------------------------------------------------------------- asymptotic

/** Σ_k (±i)^k a_k(ν) z^(−k) of A&S 9.2.7/9.2.8, summed to its smallest term (plain numbers: speed). */
function hankelSeries(order: 0 | 1, z: Complex, sign: 1 | -1): Complex {
  const mu = 4 * order * order;
  // step = ±i/z = ±i·conj(z)/|z|²
  const norm = z.re * z.re + z.im * z.im;
  const stepRe = (sign * z.im) / norm;
  const stepIm = (sign * z.re) / norm;
  let termRe = 1;
  let termIm = 0;
  let sumRe = 1;
  let sumIm = 0;
  let previous = Infinity;
  for (let k = 1; k < 100; k++) {
    const odd = 2 * k - 1;
    const factor = (mu - odd * odd) / (8 * k);
    const re = (termRe * stepRe - termIm * stepIm) * factor;
    termIm = (termRe * stepIm + termIm * stepRe) * factor;
    termRe = re;
    const size = Math.abs(termRe) + Math.abs(termIm);
    if (size >= previous) break; // the series has begun to diverge
    sumRe += termRe;
    sumIm += termIm;
    if (size < 1e-17 * (Math.abs(sumRe) + Math.abs(sumIm))) break;
    previous = size;
  }
  return new Complex(sumRe, sumIm);
}

function asymptoticScaled(z: Complex): ScaledHankel {
  const root = new Complex(TWO_OVER_PI, 0).div(z).sqrt();
  const pair = (sign: 1 | -1): BesselPair => {
    // H⁽¹⁾: e^{i(z − νπ/2 − π/4)}; scaled by e^{−iz} leaves e^{−i(νπ/2 + π/4)}. H⁽²⁾ the conjugate phase.
    const phase0 = new Complex(0, -sign * (Math.PI / 4)).exp();
    const phase1 = new Complex(0, -sign * ((3 * Math.PI) / 4)).exp();
    return {
      order0: root.mul(phase0).mul(hankelSeries(0, z, sign)),
      order1: root.mul(phase1).mul(hankelSeries(1, z, sign)),
    };
  };
  return { first: pair(1), second: pair(-1) };
}

// ---------------------------------------------------------------- public

/** J0, J1, Y0, Y1 of complex z (unscaled: overflow to Infinity/NaN beyond |Im z| ≈ 700). */
export function besselJY(z: Complex): JY {
  if (z.re < 0) {
    // Reflection: J_n(−w) = (−1)^n J_n(w); Y_n(w e^{±iπ}) = (−1)^n [Y_n(w) ± 2i J_n(w)].
    const w = z.neg();
    const base = besselJY(w);
    const sign = z.im >= 0 ? 1 : -1; // z = w e^{+iπ} when Im z ≥ 0
    const twoI = new Complex(0, 2 * sign);
    return {
      j0: base.j0,
      j1: base.j1.neg(),
      y0: base.y0.add(twoI.mul(base.j0)),
      y1: base.y1.add(twoI.mul(base.j1)).neg(),
    };
  }
  if (z.abs() <= SERIES_RADIUS) {
    if (z.abs() === 0) return { j0: Complex.ONE, j1: Complex.ZERO, y0: new Complex(-Infinity, 0), y1: new Complex(-Infinity, 0) };
    return seriesJY(z);
  }
  const h = asymptoticScaled(z);
  const grow = I.mul(z).exp(); // e^{iz}
  const decay = I.mul(z).neg().exp(); // e^{−iz}
  const h10 = h.first.order0.mul(grow);
  const h11 = h.first.order1.mul(grow);
  const h20 = h.second.order0.mul(decay);
  const h21 = h.second.order1.mul(decay);
  const twoI = new Complex(0, 2);
  return {
    j0: h10.add(h20).div(2),
    j1: h11.add(h21).div(2),
    y0: h10.sub(h20).div(twoI),
    y1: h11.sub(h21).div(twoI),
  };
}

export const besselJ0 = (z: Complex): Complex => besselJY(z).j0;
export const besselJ1 = (z: Complex): Complex => besselJY(z).j1;
export const besselY0 = (z: Complex): Complex => besselJY(z).y0;
export const besselY1 = (z: Complex): Complex => besselJY(z).y1;

/**
 * H⁽¹⁾_n(z)·e^(−iz) and H⁽²⁾_n(z)·e^(iz) for n = 0, 1 and z ≠ 0 with Re z ≥ 0 (the
 * right half-plane, where the field models' arguments (1−i)r/δ lie).
 */
export function hankelScaled(z: Complex): ScaledHankel {
  if (z.abs() > SERIES_RADIUS && z.re >= 0) return asymptoticScaled(z);
  const { j0, j1, y0, y1 } = besselJY(z);
  const toFirst = I.mul(z).neg().exp(); // e^{−iz}
  const toSecond = I.mul(z).exp(); // e^{iz}
  return {
    first: { order0: j0.add(I.mul(y0)).mul(toFirst), order1: j1.add(I.mul(y1)).mul(toFirst) },
    second: { order0: j0.sub(I.mul(y0)).mul(toSecond), order1: j1.sub(I.mul(y1)).mul(toSecond) },
  };
}

/**
 * J0 and J1 scaled by e^(−|Im z|), bounded for every z: J_n(z)e^(−|Im z|).
 * From the scaled Hankel functions, J = (H⁽¹⁾ + H⁽²⁾)/2, for Re z ≥ 0.
 */
export function besselJScaled(z: Complex): BesselPair {
  if (z.abs() <= SERIES_RADIUS) {
    const { j0, j1 } = z.abs() === 0 ? { j0: Complex.ONE, j1: Complex.ZERO } : seriesJY(z);
    const scale = Math.exp(-Math.abs(z.im));
    return { order0: j0.mul(scale), order1: j1.mul(scale) };
  }
  const h = hankelScaled(z);
  const s = Math.abs(z.im);
  // H⁽¹⁾ = h1·e^{iz}, |e^{iz}| = e^{−Im z}; H⁽²⁾ = h2·e^{−iz}, |e^{−iz}| = e^{Im z}.
  const first = new Complex(-z.im - s, z.re).exp(); // e^{iz − s}
  const second = new Complex(z.im - s, -z.re).exp(); // e^{−iz − s}
  return {
    order0: h.first.order0.mul(first).add(h.second.order0.mul(second)).div(2),
    order1: h.first.order1.mul(first).add(h.second.order1.mul(second)).div(2),
  };
}

const MINUS_45 = new Complex(Math.SQRT1_2, -Math.SQRT1_2); // e^{−iπ/4}

/** ber x + i·bei x = J0(x e^{3πi/4}) = J0(x e^{−iπ/4}) (A&S 9.9.1; J0 is even). */
export function kelvinBerBei(x: number): { ber: number; bei: number } {
  const value = besselJ0(MINUS_45.mul(x));
  return { ber: value.re, bei: value.im };
}

/** ker x + i·kei x = K0(x e^{iπ/4}) = −(πi/2)·H⁽²⁾_0(x e^{−iπ/4}) (A&S 9.9.2 with 9.6.4), x > 0. */
export function kelvinKerKei(x: number): { ker: number; kei: number } {
  const z = MINUS_45.mul(x);
  const h = hankelScaled(z).second.order0.mul(I.mul(z).neg().exp()); // H⁽²⁾_0(z)
  const value = h.mul(new Complex(0, -Math.PI / 2));
  return { ker: value.re, kei: value.im };
}
