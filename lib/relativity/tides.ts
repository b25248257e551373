/**
 * Tidal tensor (electric part of the Riemann tensor) in an observer's frame.
 * In any orthonormal frame whose e1 is radial and whose e0 lies in the t-r
 * plane (static or radially moving observers), the Schwarzschild Riemann
 * tensor has only the components (MTW 1973 eq. 31.4, M = 1)
 *   R_0101 = -2/r^3, R_0202 = R_0303 = 1/r^3, R_2323 = 2/r^3, R_1212 = R_1313 = -1/r^3,
 * with indices 0 = time, 1 = radial, 2 and 3 = the angular directions.
 */

/** Bivector curvature K_ab (a < b) in units of 1/r^3, MTW eq. 31.4. Order: 01, 02, 03, 12, 13, 23. */
const BIVECTOR_CURVATURE = [-2, 1, 1, -1, -1, 2];
const PAIRS_A = [0, 0, 0, 1, 1, 2];
const PAIRS_B = [1, 2, 3, 2, 3, 3];

/**
 * Riemann tensor R(X, Y, Z, W) for vectors given by orthonormal components in a
 * radial frame at radius r: sum over planes K_ab (X^a Y^b - X^b Y^a)(Z^a W^b - Z^b W^a).
 * @param r radius in M (> 0)
 * @returns R_abcd X^a Y^b Z^c W^d in M^-2
 */
export function riemannContract(r: number, X: ArrayLike<number>, Y: ArrayLike<number>, Z: ArrayLike<number>, W: ArrayLike<number>): number {
  const scale = 1 / (r * r * r);
  let sum = 0;
  for (let p = 0; p < 6; p++) {
    const a = PAIRS_A[p];
    const b = PAIRS_B[p];
    sum += BIVECTOR_CURVATURE[p] * (X[a] * Y[b] - X[b] * Y[a]) * (Z[a] * W[b] - Z[b] * W[a]);
  }
  return sum * scale;
}

/**
 * Tidal acceleration tensor T_ij = -R(e_i, u, e_j, u) of an observer: the relative
 * acceleration of a particle displaced by xi is T xi (positive eigenvalue: stretch).
 * @param out 9 entries, row-major, written
 * @param r radius in M (> 0)
 * @param frame 16 numbers: rows e0 (= u), e1, e2, e3 as orthonormal components in a radial reference frame
 * @returns out, in M^-2
 * Reference: MTW 1973 eqs. 11.10 and 31.4 (geodesic deviation).
 */
export function tidalTensor(out: Float64Array, r: number, frame: Float64Array): Float64Array {
  const u = frame.subarray(0, 4);
  for (let i = 0; i < 3; i++) {
    const ei = frame.subarray(4 * (i + 1), 4 * (i + 2));
    for (let j = i; j < 3; j++) {
      const ej = frame.subarray(4 * (j + 1), 4 * (j + 2));
      const value = -riemannContract(r, ei, u, ej, u);
      out[3 * i + j] = value;
      out[3 * j + i] = value;
    }
  }
  return out;
}

/**
 * Eigenvalues of a symmetric 3x3 matrix (closed-form trigonometric method), descending.
 * @param out 3 entries written: largest first
 * @param m 9 entries row-major, symmetric
 * Reference: Smith 1961, Comm. ACM 4, 168.
 */
export function symmetricEigenvalues3(out: Float64Array, m: Float64Array): Float64Array {
  const p1 = m[1] * m[1] + m[2] * m[2] + m[5] * m[5];
  const q = (m[0] + m[4] + m[8]) / 3;
  if (p1 <= 1e-30 * (m[0] * m[0] + m[4] * m[4] + m[8] * m[8])) {
    const a = [m[0], m[4], m[8]].sort((x, y) => y - x);
    out[0] = a[0];
    out[1] = a[1];
    out[2] = a[2];
    return out;
  }
  const p2 = (m[0] - q) ** 2 + (m[4] - q) ** 2 + (m[8] - q) ** 2 + 2 * p1;
  const p = Math.sqrt(p2 / 6);
  const b0 = (m[0] - q) / p;
  const b4 = (m[4] - q) / p;
  const b8 = (m[8] - q) / p;
  const b1 = m[1] / p;
  const b2 = m[2] / p;
  const b5 = m[5] / p;
  const det = b0 * (b4 * b8 - b5 * b5) - b1 * (b1 * b8 - b5 * b2) + b2 * (b1 * b5 - b4 * b2);
  const half = Math.max(-1, Math.min(1, det / 2));
  const angle = Math.acos(half) / 3;
  out[0] = q + 2 * p * Math.cos(angle);
  out[2] = q + 2 * p * Math.cos(angle + (2 * Math.PI) / 3);
  out[1] = 3 * q - out[0] - out[2];
  return out;
}

/**
 * Tidal stretch and squeeze per unit length for static or radially moving observers.
 * @param r radius in M, > 0
 * @returns { stretch: 2/r^3, squeeze: 1/r^3 } in M^-2
 * Reference: MTW 1973 eq. 31.4; Hartle 2003 ch. 21.
 */
export function radialTidalComponents(r: number): { stretch: number; squeeze: number } {
  if (!(Number.isFinite(r) && r > 0)) throw new RangeError(`r must be a finite radius > 0 in units of M; got ${r}`);
  const inv = 1 / (r * r * r);
  return { stretch: 2 * inv, squeeze: inv };
}
