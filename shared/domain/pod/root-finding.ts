// A bracketed root finder: the Illinois variant of regula falsi, which keeps the root inside
// [lo, hi] at every step and converges superlinearly on smooth monotone functions.

export function findRoot(f: (x: number) => number, lo: number, hi: number, tolerance = 1e-10, maxIterations = 200): number {
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (Math.sign(fa) === Math.sign(fb)) throw new Error('findRoot: the interval does not bracket a root');
  let side = 0;
  for (let i = 0; i < maxIterations; i++) {
    const c = (a * fb - b * fa) / (fb - fa);
    const fc = f(c);
    if (Math.abs(fc) < 1e-14 || Math.abs(b - a) < tolerance * Math.max(1, Math.abs(c))) return c;
    if (Math.sign(fc) === Math.sign(fb)) {
      b = c;
      fb = fc;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      a = c;
      fa = fc;
      if (side === 1) fb /= 2;
      side = 1;
    }
  }
  return (a + b) / 2;
}
