// Small dense matrices (at most 4×4 here): solve, inverse and a definiteness check.

export type Matrix = number[][];

/** Solves A x = b by Gaussian elimination with partial pivoting; null when A is singular. */
export function solve(a: Matrix, b: number[]): number[] | null {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r][col]) > Math.abs(m[pivot][col])) pivot = r;
    if (!(Math.abs(m[pivot][col]) > 1e-300)) return null;
    [m[col], m[pivot]] = [m[pivot], m[col]];
    for (let r = col + 1; r < n; r++) {
      const f = m[r][col] / m[col][col];
      for (let c = col; c <= n; c++) m[r][c] -= f * m[col][c];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let c = r + 1; c < n; c++) s -= m[r][c] * x[c];
    x[r] = s / m[r][r];
  }
  return x.every(Number.isFinite) ? x : null;
}

/** The inverse of A, or null when A is singular. */
export function invert(a: Matrix): Matrix | null {
  const n = a.length;
  const columns: number[][] = [];
  for (let j = 0; j < n; j++) {
    const e = new Array<number>(n).fill(0);
    e[j] = 1;
    const x = solve(a, e);
    if (!x) return null;
    columns.push(x);
  }
  return a.map((_, i) => columns.map((col) => col[i]));
}

/** True when the symmetric matrix A is positive definite (a Cholesky factorisation succeeds). */
export function isPositiveDefinite(a: Matrix): boolean {
  const n = a.length;
  const l: Matrix = a.map(() => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i][j];
      for (let k = 0; k < j; k++) s -= l[i][k] * l[j][k];
      if (i === j) {
        if (!(s > 0)) return false;
        l[i][i] = Math.sqrt(s);
      } else {
        l[i][j] = s / l[j][j];
      }
    }
  }
  return true;
}

/** u' A v */
export function quadraticForm(a: Matrix, u: number[], v: number[] = u): number {
  let s = 0;
  for (let i = 0; i < u.length; i++) for (let j = 0; j < v.length; j++) s += u[i] * a[i][j] * v[j];
  return s;
}

export function norm(v: number[]): number {
  return Math.sqrt(v.reduce((s, x) => s + x * x, 0));
}
