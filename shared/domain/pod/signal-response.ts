// Signal-response (â vs a) POD: ln â = β0 + β1·ln a + ε, ε ~ N(0, τ²), fitted by maximum likelihood
// with left-censoring at the recording threshold and right-censoring at saturation. With a decision
// threshold â_dec, POD(a) = Φ((ln a − μ)/σ), μ = (ln â_dec − β0)/β1, σ = τ/β1; a90/95 by the delta
// method on the inverse observed information, as MIL-HDBK-1823A (2009) does.
import { chiSquareQuantile, normalCdf, normalQuantile } from './distributions';
import { fitCensored, type CensoredObservation } from './censored-regression';
import { invert, quadraticForm, type Matrix } from './linear-algebra';
import { falseCalls, type FalseCallEstimate } from './false-calls';
import { refuse, type Convergence, type PodCurvePoint, type PodOutcome, type Warning } from './types';

export interface SignalObservation {
  sizeMm: number;
  /** Signal amplitude â in the demonstration's stated units. */
  signal: number;
}

export interface SignalResponseOptions {
  decisionThreshold: number;
  /** Signals at or below it are recorded as "below threshold" (left-censored). */
  recordingThreshold?: number;
  /** Signals at or above it are saturated (right-censored). */
  saturation?: number;
  /** â measured on flaw-free sites, for the false-call probability. */
  noise?: number[];
  /** Decision thresholds for the trade-off table; a geometric range by default. */
  tradeOffThresholds?: number[];
}

/** The handbook's guidance on the number of flawed sites for an â vs a demonstration (from memory). */
export const SIGNAL_RESPONSE_MIN_SPECIMENS = 40;

const Z_95 = normalQuantile(0.95);
const Z_90 = normalQuantile(0.9);
const CURVE_PODS = [0.02, 0.05, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 0.95, 0.98, 0.99];

export interface SignalResidual {
  sizeMm: number;
  signal: number;
  censoring: 'none' | 'left' | 'right';
  fittedLnSignal: number;
  /** (ln â − fit)/τ for uncensored points; null for censored ones. */
  standardised: number | null;
}

export interface TradeOffRow {
  decisionThreshold: number;
  a50Mm: number;
  a90Mm: number;
  a9095Mm: number;
  falseCallProbability: number | null;
  falseCallFraction: number | null;
}

export interface SignalResponseAnalysis {
  model: 'signal-response';
  n: number;
  censoredBelow: number;
  censoredAbove: number;
  /** ln â = β0 + β1·ln a + ε, ε ~ N(0, τ²), a in mm and â in the demonstration's units. */
  parameters: { beta0: number; beta1: number; tau: number };
  /** Inverse observed information of (β0, β1, τ). */
  covariance: Matrix;
  convergence: Convergence;
  decisionThreshold: number;
  recordingThreshold: number | null;
  saturation: number | null;
  /** POD(a) = Φ((ln a − μ)/σ). */
  pod: { mu: number; sigma: number };
  a50Mm: number;
  a90Mm: number;
  a9095Mm: number;
  curve: PodCurvePoint[];
  residuals: SignalResidual[];
  linearity: { statistic: number | null; criticalValue: number; note: string };
  constantVariance: { statistic: number | null; criticalValue: number; note: string };
  falseCalls: FalseCallEstimate | null;
  tradeOff: TradeOffRow[];
  warnings: Warning[];
}

function censor(d: SignalObservation, options: SignalResponseOptions): CensoredObservation['censoring'] {
  if (options.recordingThreshold !== undefined && d.signal <= options.recordingThreshold) return 'left';
  if (options.saturation !== undefined && d.signal >= options.saturation) return 'right';
  return 'none';
}

function checkInput(data: SignalObservation[], options: SignalResponseOptions) {
  const { decisionThreshold, recordingThreshold, saturation } = options;
  if (data.length < 3) return refuse('too_few_observations', 'At least three observations are needed for three parameters.');
  if (data.some((d) => !Number.isFinite(d.sizeMm) || !Number.isFinite(d.signal))) return refuse('invalid_input', 'Every size and signal must be a number.');
  if (data.some((d) => d.sizeMm <= 0)) return refuse('non_positive_size', 'The model is in ln(size): every size must be greater than zero.');
  if (!(decisionThreshold > 0)) return refuse('invalid_thresholds', 'The decision threshold must be greater than zero.');
  if (recordingThreshold !== undefined && !(recordingThreshold > 0)) return refuse('invalid_thresholds', 'The recording threshold must be greater than zero.');
  if (recordingThreshold !== undefined && decisionThreshold < recordingThreshold)
    return refuse('invalid_thresholds', 'The decision threshold lies below the recording threshold: signals there are not recorded.');
  if (saturation !== undefined && decisionThreshold >= saturation) return refuse('invalid_thresholds', 'The decision threshold must lie below saturation.');
  if (saturation !== undefined && recordingThreshold !== undefined && saturation <= recordingThreshold)
    return refuse('invalid_thresholds', 'Saturation must lie above the recording threshold.');
  const uncensored = data.filter((d) => censor(d, options) === 'none');
  if (uncensored.some((d) => d.signal <= 0))
    return refuse('non_positive_signal', 'The model is in ln(signal): every recorded signal above the recording threshold must be greater than zero.');
  if (uncensored.length < 3) return refuse('too_few_uncensored', `Only ${uncensored.length} signals lie between the recording threshold and saturation: at least three are needed.`);
  if (new Set(uncensored.map((d) => d.sizeMm)).size < 2)
    return refuse('too_few_sizes', 'The signals between the limits come from a single size: the slope cannot be estimated.');
  return null;
}

function observations(data: SignalObservation[], options: SignalResponseOptions, quadratic = false, centre = 0): CensoredObservation[] {
  return data.map((d) => {
    const censoring = censor(d, options);
    const x = Math.log(d.sizeMm);
    const y = censoring === 'left' ? Math.log(options.recordingThreshold!) : censoring === 'right' ? Math.log(options.saturation!) : Math.log(d.signal);
    return { row: quadratic ? [1, x - centre, (x - centre) ** 2] : [1, x], y, censoring };
  });
}

export function analyseSignalResponse(data: SignalObservation[], options: SignalResponseOptions): PodOutcome<SignalResponseAnalysis> {
  const refused = checkInput(data, options);
  if (refused) return refused;
  const obs = observations(data, options);
  const fit = fitCensored(obs);
  if (!fit.converged) return refuse('not_converged', `The fit did not converge in ${fit.iterations} iterations.`);
  const [beta0, beta1, s] = fit.theta;
  const tau = Math.exp(s);
  if (!(beta1 > 0)) return refuse('decreasing_with_size', 'The fitted signal does not grow with size: no POD curve.');
  const covLog = invert(fit.information);
  if (!covLog) return refuse('not_converged', 'The information matrix is singular at the fit.');
  // Covariance of (β0, β1, τ) from that of (β0, β1, s): dτ/ds = τ.
  const jac = [1, 1, tau];
  const covariance = covLog.map((row, i) => row.map((v, j) => v * jac[i] * jac[j]));

  const at = (decisionThreshold: number) => {
    const lnDec = Math.log(decisionThreshold);
    // x_p = (ln â_dec − β0 + z_p τ)/β1; its gradient in (β0, β1, s) for the delta method.
    const xAt = (z: number) => (lnDec - beta0 + z * tau) / beta1;
    const bound = (z: number) => {
      const x = xAt(z);
      const gradient = [-1 / beta1, -x / beta1, (z * tau) / beta1];
      return x + Z_95 * Math.sqrt(quadraticForm(covLog, gradient));
    };
    return { mu: xAt(0), sigma: tau / beta1, xAt, bound };
  };
  const chosen = at(options.decisionThreshold);

  const warnings: Warning[] = [];
  if (data.length < SIGNAL_RESPONSE_MIN_SPECIMENS)
    warnings.push({
      code: 'few_specimens',
      message: `${data.length} flawed sites: below the ${SIGNAL_RESPONSE_MIN_SPECIMENS} the handbook recommends for a signal-response demonstration (from memory).`,
    });
  const linearity = linearityCheck(data, options, fit.logLikelihood);
  if (linearity.statistic !== null && linearity.statistic > linearity.criticalValue) warnings.push({ code: 'nonlinear', message: linearity.note });
  const residuals: SignalResidual[] = data.map((d, i) => {
    const fitted = beta0 + beta1 * Math.log(d.sizeMm);
    return {
      sizeMm: d.sizeMm,
      signal: d.signal,
      censoring: obs[i].censoring,
      fittedLnSignal: fitted,
      standardised: obs[i].censoring === 'none' ? (obs[i].y - fitted) / tau : null,
    };
  });
  const constantVariance = varianceCheck(residuals);
  if (constantVariance.statistic !== null && constantVariance.statistic > constantVariance.criticalValue)
    warnings.push({ code: 'non_constant_variance', message: constantVariance.note });

  const noise = options.noise && options.noise.length > 0 ? options.noise : null;
  const tradeOff = tradeOffThresholds(data, options).map((threshold) => {
    const t = at(threshold);
    const calls = noise ? falseCalls(noise, threshold) : null;
    return {
      decisionThreshold: threshold,
      a50Mm: Math.exp(t.mu),
      a90Mm: Math.exp(t.xAt(Z_90)),
      a9095Mm: Math.exp(t.bound(Z_90)),
      falseCallProbability: calls?.normalFitProbability ?? null,
      falseCallFraction: calls?.empiricalFraction ?? null,
    };
  });

  return {
    ok: true,
    model: 'signal-response',
    n: data.length,
    censoredBelow: obs.filter((o) => o.censoring === 'left').length,
    censoredAbove: obs.filter((o) => o.censoring === 'right').length,
    parameters: { beta0, beta1, tau },
    covariance,
    convergence: { converged: fit.converged, iterations: fit.iterations, gradientNorm: fit.gradientNorm, logLikelihood: fit.logLikelihood },
    decisionThreshold: options.decisionThreshold,
    recordingThreshold: options.recordingThreshold ?? null,
    saturation: options.saturation ?? null,
    pod: { mu: chosen.mu, sigma: chosen.sigma },
    a50Mm: Math.exp(chosen.mu),
    a90Mm: Math.exp(chosen.xAt(Z_90)),
    a9095Mm: Math.exp(chosen.bound(Z_90)),
    curve: CURVE_PODS.map((p) => {
      const z = normalQuantile(p);
      return { pod: p, sizeMm: Math.exp(chosen.xAt(z)), bound95SizeMm: Math.exp(chosen.bound(z)) };
    }),
    residuals,
    linearity,
    constantVariance,
    falseCalls: noise ? falseCalls(noise, options.decisionThreshold) : null,
    tradeOff,
    warnings,
  };
}

/** POD at size a for the fitted curve. */
export function signalPod(analysis: Pick<SignalResponseAnalysis, 'pod'>, sizeMm: number): number {
  return normalCdf((Math.log(sizeMm) - analysis.pod.mu) / analysis.pod.sigma);
}

function tradeOffThresholds(data: SignalObservation[], options: SignalResponseOptions): number[] {
  if (options.tradeOffThresholds) return [...options.tradeOffThresholds].filter((t) => t > 0).sort((a, b) => a - b);
  const positive = data.map((d) => d.signal).filter((v) => v > 0);
  const lo = options.recordingThreshold ?? Math.min(...positive);
  const hi = Math.min(options.saturation ?? Infinity, Math.max(...positive));
  const rows = 9;
  const grid = Array.from({ length: rows }, (_, i) => lo * (hi / lo) ** (i / (rows - 1)) * (i === rows - 1 ? 0.999 : 1));
  return [...new Set([...grid, options.decisionThreshold])].sort((a, b) => a - b);
}

/** Compares the fit with one that adds (ln a)² by likelihood ratio (χ²₁, 95 %). */
function linearityCheck(data: SignalObservation[], options: SignalResponseOptions, linearLogLik: number) {
  const criticalValue = chiSquareQuantile(0.95, 1);
  const xs = data.map((d) => Math.log(d.sizeMm));
  const centre = xs.reduce((acc, x) => acc + x, 0) / xs.length;
  if (new Set(xs).size < 3) return { statistic: null, criticalValue, note: 'Fewer than three sizes: linearity was not checked.' };
  const fit = fitCensored(observations(data, options, true, centre));
  if (!fit.converged) return { statistic: null, criticalValue, note: 'A quadratic term could not be fitted; linearity was not checked.' };
  const statistic = Math.max(0, 2 * (fit.logLikelihood - linearLogLik));
  return {
    statistic,
    criticalValue,
    note:
      statistic > criticalValue
        ? 'A quadratic term in ln(size) improves the fit significantly (5 % level): ln â may not be linear in ln a.'
        : 'A quadratic term in ln(size) does not improve the fit significantly (5 % level).',
  };
}

/**
 * Koenker's studentised Breusch–Pagan test on the uncensored points: regress the squared
 * standardised residuals on ln a; n·R² is χ²₁ under constant variance.
 */
function varianceCheck(residuals: SignalResidual[]) {
  const criticalValue = chiSquareQuantile(0.95, 1);
  const points = residuals.filter((r) => r.standardised !== null).map((r) => ({ x: Math.log(r.sizeMm), e2: r.standardised! ** 2 }));
  if (points.length < 4) return { statistic: null, criticalValue, note: 'Too few uncensored points: constant variance was not checked.' };
  const n = points.length;
  const mx = points.reduce((acc, p) => acc + p.x, 0) / n;
  const me = points.reduce((acc, p) => acc + p.e2, 0) / n;
  const sxx = points.reduce((acc, p) => acc + (p.x - mx) ** 2, 0);
  const sxe = points.reduce((acc, p) => acc + (p.x - mx) * (p.e2 - me), 0);
  const see = points.reduce((acc, p) => acc + (p.e2 - me) ** 2, 0);
  const statistic = sxx > 0 && see > 0 ? (n * (sxe * sxe)) / (sxx * see) : 0;
  return {
    statistic,
    criticalValue,
    note:
      statistic > criticalValue
        ? 'The scatter of ln â changes with size (Breusch–Pagan, 5 % level): the constant-variance assumption is doubtful.'
        : 'No significant change of the scatter with size (Breusch–Pagan, 5 % level).',
  };
}
