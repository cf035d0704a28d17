// Limit (characteristic) frequency of a tube from the long-coil tube model.
//
// Förster's thin-wall f_g = 2/(π μ0 σ d_i w) is the frequency at which a thin wall's
// shielding time constant equals 1/ω: the field that reaches the bore,
// H_bore/H_surface = 1/(1 + i f/f_g), lags the surface field by 45°. That definition
// is taken over as it stands and evaluated with the full tube model: f_g of a tube is
// the frequency at which the field transmitted to the bore lags the field at the
// outer surface by 45°. For thin walls it gives the thin-wall formula (the tests hold
// them within 2 % for w ≤ 5 % of the bore radius at μr = 1); for thick walls it counts
// the wall's real thickness, where the thin-wall formula (which sees only d_i·w)
// drifts. The transmitted field's lag grows without bound with frequency
// (e^{−(1+i)w/δ} through a thick wall), so the frequency always exists.
// Bars keep Förster's solid-cylinder f_g (a different normalisation: there the bore
// field lags 45° at about 3.3·f_g), so the tube value is not continuous with the bar
// value as the bore closes; docs/domain-long-coils.md states both.
import { transmittedFieldRatio } from './cylinder';
import { MU0_H_PER_M } from '../physics';

const TARGET_RAD = -Math.PI / 4;
const cache = new Map<string, number>();

/** Thin-wall estimate 2/(π μ0 σ d_i w) (μr left out: a thin wall's shielding does not depend on it). */
function thinWallEstimateHz(outerRadiusMm: number, innerRadiusMm: number, conductivityMsPerM: number): number {
  const wallM = (outerRadiusMm - innerRadiusMm) / 1000;
  return 2 / (Math.PI * MU0_H_PER_M * conductivityMsPerM * 1e6 * ((2 * innerRadiusMm) / 1000) * wallM);
}

/** The frequency (Hz) at which the field reaching a tube's bore lags its outer surface field by 45°. */
export function tubeLimitFrequencyHz(outerRadiusMm: number, innerRadiusMm: number, conductivityMsPerM: number, relativePermeability: number): number {
  if (!(outerRadiusMm > innerRadiusMm && innerRadiusMm > 0 && conductivityMsPerM > 0 && relativePermeability > 0)) return NaN;
  const key = `${outerRadiusMm}|${innerRadiusMm}|${conductivityMsPerM}|${relativePermeability}`;
  const hit = cache.get(key);
  if (hit !== undefined) return hit;
  const logLag = (logF: number) =>
    transmittedFieldRatio(outerRadiusMm, innerRadiusMm, conductivityMsPerM, relativePermeability, Math.exp(logF)).arg() - TARGET_RAD;
  // The lag starts at 0 and grows continuously with f; its principal value wraps past 180°
  // at higher f, so step up from well below by factors of 2 (the lag changes by well under
  // 180° per step) to the first crossing of 45°, then refine by regula falsi (Illinois) in log f.
  // Start below both the thin-wall estimate and the solid bar's f_g of the same outside
  // radius (where the axis field of a bar lags only 14°), so no wrap has happened yet.
  const solidHz = 1 / (2 * Math.PI * MU0_H_PER_M * conductivityMsPerM * 1e6 * relativePermeability * (outerRadiusMm / 1000) ** 2);
  const estimate = Math.min(
    thinWallEstimateHz(outerRadiusMm, innerRadiusMm, conductivityMsPerM),
    thinWallEstimateHz(outerRadiusMm, innerRadiusMm, conductivityMsPerM * relativePermeability),
    solidHz,
  );
  let low = Math.log(estimate / 8);
  let gLow = logLag(low);
  for (let step = 0; gLow <= 0 && step < 100; step++) {
    low -= Math.LN2 * 4;
    gLow = logLag(low);
  }
  let high = low + Math.LN2;
  let gHigh = logLag(high);
  for (let step = 0; gHigh > 0 && step < 400; step++) {
    low = high;
    gLow = gHigh;
    high += Math.LN2;
    gHigh = logLag(high);
  }
  if (!(gLow > 0 && gHigh <= 0)) return NaN; // no crossing found (degenerate input)
  let side = 0;
  for (let i = 0; i < 60 && high - low > 1e-9; i++) {
    const mid = (low * gHigh - high * gLow) / (gHigh - gLow);
    const g = logLag(mid);
    if (g > 0) {
      low = mid;
      gLow = g;
      if (side === 1) gHigh /= 2;
      side = 1;
    } else {
      high = mid;
      gHigh = g;
      if (side === -1) gLow /= 2;
      side = -1;
    }
    if (Math.abs(g) < 1e-12) {
      low = high = mid;
    }
  }
  const result = Math.exp((low + high) / 2);
  if (cache.size > 2000) cache.clear();
  cache.set(key, result);
  return result;
}
