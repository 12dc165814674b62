/**
 * Dense least squares min ||A x - b|| by Householder QR in double precision, for the small
 * systems inside the non-linear fitter (a handful of parameters). Returns the solution and the
 * upper-triangular factor R, so that (A^T A)^-1 = R^-1 R^-T can be formed for standard errors.
 * Returns null when A is numerically rank deficient.
 */
export function householderLeastSquares(
  matrix: readonly (readonly number[])[],
  rhs: readonly number[],
): { solution: number[]; r: number[][]; residualNorm: number } | null {
  const rows = matrix.length;
  const cols = rows === 0 ? 0 : matrix[0].length;
  const a = matrix.map((row) => row.slice());
  const b = rhs.slice();
  for (let j = 0; j < cols; j += 1) {
    let norm = 0;
    for (let i = j; i < rows; i += 1) norm = Math.hypot(norm, a[i][j]);
    if (norm === 0) return null;
    const alpha = a[j][j] >= 0 ? -norm : norm;
    const v: number[] = [];
    for (let i = j; i < rows; i += 1) v.push(a[i][j]);
    v[0] -= alpha;
    let vNormSquared = 0;
    for (const entry of v) vNormSquared += entry * entry;
    if (vNormSquared === 0) continue;
    for (let k = j + 1; k < cols; k += 1) {
      let dot = 0;
      for (let i = 0; i < v.length; i += 1) dot += v[i] * a[j + i][k];
      const factor = (2 * dot) / vNormSquared;
      for (let i = 0; i < v.length; i += 1) a[j + i][k] -= factor * v[i];
    }
    let dot = 0;
    for (let i = 0; i < v.length; i += 1) dot += v[i] * b[j + i];
    const factor = (2 * dot) / vNormSquared;
    for (let i = 0; i < v.length; i += 1) b[j + i] -= factor * v[i];
    a[j][j] = alpha;
    for (let i = j + 1; i < rows; i += 1) a[i][j] = 0;
  }
  let largest = 0;
  for (let j = 0; j < cols; j += 1) largest = Math.max(largest, Math.abs(a[j][j]));
  for (let j = 0; j < cols; j += 1) {
    if (Math.abs(a[j][j]) <= largest * 1e-14) return null;
  }
  const solution = new Array<number>(cols).fill(0);
  for (let row = cols - 1; row >= 0; row -= 1) {
    let sum = b[row];
    for (let col = row + 1; col < cols; col += 1) sum -= a[row][col] * solution[col];
    solution[row] = sum / a[row][row];
  }
  let residualNorm = 0;
  for (let i = cols; i < rows; i += 1) residualNorm = Math.hypot(residualNorm, b[i]);
  const r = Array.from({ length: cols }, (_, i) => a[i].slice(0, cols));
  return { solution, r, residualNorm };
}

/** (R^T R)^-1 from an upper-triangular R. */
export function inverseGramFromR(r: readonly (readonly number[])[]): number[][] {
  const size = r.length;
  const inverse = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  for (let col = 0; col < size; col += 1) {
    inverse[col][col] = 1 / r[col][col];
    for (let row = col - 1; row >= 0; row -= 1) {
      let sum = 0;
      for (let k = row + 1; k <= col; k += 1) sum += r[row][k] * inverse[k][col];
      inverse[row][col] = -sum / r[row][row];
    }
  }
  return Array.from({ length: size }, (_, i) =>
    Array.from({ length: size }, (_unused, j) => {
      let sum = 0;
      for (let k = Math.max(i, j); k < size; k += 1) sum += inverse[i][k] * inverse[j][k];
      return sum;
    }),
  );
}
