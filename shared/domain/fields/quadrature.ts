// Numerical integration for the coil field models.
//
// Two tools, one job each:
// - `gaussLegendreRule(n)`: n-point Gauss–Legendre nodes and weights on [−1, 1], found by
//   Newton's iteration on the Legendre recurrence (exact for polynomials of degree 2n − 1;
//   nodes to ~1e-15). The field models build composite rules from it on a fixed grid of
//   panels, so the coil's own factors are computed once per coil and reused for every
//   frequency and layer stack.
// - `integrateAdaptive` / `integrateAdaptiveComplex`: globally adaptive Gauss–Kronrod
//   (7-point Gauss embedded in the 15-point Kronrod rule, the QUADPACK QAG scheme): the
//   panel with the largest error estimate |K15 − G7| is halved until the summed estimate
//   meets max(absTol, relTol·|I|). For smooth integrands the K15 result is accurate far
//   beyond the estimate. Used where no fixed grid exists (volume integrals of a field,
//   independent checks). `integrateToInfinity` sums adaptive panels of a given width until
//   several panels in a row add less than the tolerance (for integrands that decay).

const gaussLegendreCache = new Map<number, { nodes: Float64Array; weights: Float64Array }>();

/** n-point Gauss–Legendre rule on [−1, 1]. */
export function gaussLegendreRule(n: number): { nodes: Float64Array; weights: Float64Array } {
  const cached = gaussLegendreCache.get(n);
  if (cached) return cached;
  const nodes = new Float64Array(n);
  const weights = new Float64Array(n);
  const half = Math.floor((n + 1) / 2);
  for (let i = 0; i < half; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let derivative = 0;
    for (let iteration = 0; iteration < 100; iteration++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      if (n === 1) p0 = 1;
      derivative = (n * (x * p1 - p0)) / (x * x - 1);
      const step = p1 / derivative;
      x -= step;
      if (Math.abs(step) < 1e-16) break;
    }
    nodes[i] = -x;
    nodes[n - 1 - i] = x;
    const w = 2 / ((1 - x * x) * derivative * derivative);
    weights[i] = w;
    weights[n - 1 - i] = w;
  }
  const rule = { nodes, weights };
  gaussLegendreCache.set(n, rule);
  return rule;
}

// Kronrod 15-point nodes (positive half) and weights, with the embedded 7-point Gauss weights (QUADPACK qk15).
const XGK = [
  0.991455371120812639206854697526329, 0.949107912342758524526189684047851, 0.864864423359769072789712788640926,
  0.741531185599394439863864773280788, 0.586087235467691130294144845693013, 0.405845151377397166906606412076961,
  0.207784955007898467600689403773245, 0.0,
];
const WGK = [
  0.022935322010529224963732008058970, 0.063092092629978553290700663189204, 0.104790010322250183839876322541518,
  0.140653259715525918745189590510238, 0.169004726639267902826583426598550, 0.190350578064785409913256402421014,
  0.204432940075298892414161999234649, 0.209482141084727828012999174891714,
];
const WG = [0.129484966168869693270611432679082, 0.279705391489276667901467771423780, 0.381830050505118944950369775488975, 0.417959183673469387755102040816327];

/** A function returning a complex value as [re, im]. */
export type ComplexIntegrand = (x: number) => readonly [number, number];

interface Panel {
  a: number;
  b: number;
  re: number;
  im: number;
  error: number;
}

function kronrodPanel(f: ComplexIntegrand, a: number, b: number): Panel {
  const centre = 0.5 * (a + b);
  const halfLength = 0.5 * (b - a);
  const [fcRe, fcIm] = f(centre);
  let kRe = fcRe * WGK[7];
  let kIm = fcIm * WGK[7];
  let gRe = fcRe * WG[3];
  let gIm = fcIm * WG[3];
  for (let j = 0; j < 7; j++) {
    const dx = halfLength * XGK[j];
    const [lRe, lIm] = f(centre - dx);
    const [rRe, rIm] = f(centre + dx);
    kRe += WGK[j] * (lRe + rRe);
    kIm += WGK[j] * (lIm + rIm);
    if (j % 2 === 1) {
      const w = WG[(j - 1) / 2];
      gRe += w * (lRe + rRe);
      gIm += w * (lIm + rIm);
    }
  }
  kRe *= halfLength;
  kIm *= halfLength;
  gRe *= halfLength;
  gIm *= halfLength;
  return { a, b, re: kRe, im: kIm, error: Math.hypot(kRe - gRe, kIm - gIm) };
}

export interface AdaptiveOptions {
  absTol?: number;
  relTol?: number;
  /** Largest number of panels before giving up (the best estimate is returned). */
  maxPanels?: number;
}

export interface ComplexIntegral {
  re: number;
  im: number;
  /** Summed |K15 − G7| estimate: an upper bound in practice for smooth integrands. */
  errorEstimate: number;
}

/** ∫_a^b f(x) dx for a complex-valued f, globally adaptive Gauss–Kronrod G7–K15. */
export function integrateAdaptiveComplex(f: ComplexIntegrand, a: number, b: number, options: AdaptiveOptions = {}): ComplexIntegral {
  const { absTol = 1e-12, relTol = 1e-9, maxPanels = 2000 } = options;
  const panels: Panel[] = [kronrodPanel(f, a, b)];
  for (;;) {
    let re = 0;
    let im = 0;
    let error = 0;
    let worst = 0;
    for (let i = 0; i < panels.length; i++) {
      re += panels[i].re;
      im += panels[i].im;
      error += panels[i].error;
      if (panels[i].error > panels[worst].error) worst = i;
    }
    if (error <= Math.max(absTol, relTol * Math.hypot(re, im)) || panels.length >= maxPanels) return { re, im, errorEstimate: error };
    const { a: pa, b: pb } = panels[worst];
    const middle = 0.5 * (pa + pb);
    panels[worst] = kronrodPanel(f, pa, middle);
    panels.push(kronrodPanel(f, middle, pb));
  }
}

/** ∫_a^b f(x) dx for a real f (see integrateAdaptiveComplex). */
export function integrateAdaptive(f: (x: number) => number, a: number, b: number, options: AdaptiveOptions = {}): number {
  return integrateAdaptiveComplex((x) => [f(x), 0], a, b, options).re;
}

/**
 * ∫_a^∞ f(x) dx for an f that decays: adaptive panels of width `panelWidth` are added until
 * `quietPanels` panels in a row each change the sum by less than the tolerance.
 */
export function integrateToInfinity(
  f: ComplexIntegrand,
  a: number,
  panelWidth: number,
  options: AdaptiveOptions & { quietPanels?: number; maxLength?: number } = {},
): ComplexIntegral {
  const { absTol = 1e-12, relTol = 1e-9, quietPanels = 4, maxLength = Infinity } = options;
  let re = 0;
  let im = 0;
  let errorEstimate = 0;
  let quiet = 0;
  for (let start = a; start - a < maxLength; start += panelWidth) {
    const panel = integrateAdaptiveComplex(f, start, start + panelWidth, { absTol: absTol / 4, relTol, maxPanels: 200 });
    re += panel.re;
    im += panel.im;
    errorEstimate += panel.errorEstimate;
    const size = Math.hypot(panel.re, panel.im);
    quiet = size <= Math.max(absTol, relTol * Math.hypot(re, im)) ? quiet + 1 : 0;
    if (quiet >= quietPanels) break;
  }
  return { re, im, errorEstimate };
}
