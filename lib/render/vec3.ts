/**
 * Tiny 3-vector helpers on plain number triples, gl-matrix style: `op(out, ...)`
 * writes into `out` so per-pixel code allocates nothing.
 */
export type Vec3 = number[] | Float64Array;

/** out = a normalised; a zero vector throws RangeError (caller bug). */
export function normalize3(out: Vec3, a: ArrayLike<number>): Vec3 {
  const len = Math.hypot(a[0], a[1], a[2]);
  if (!(len > 0) || !Number.isFinite(len)) throw new RangeError('vector: length must be finite and > 0');
  out[0] = a[0] / len;
  out[1] = a[1] / len;
  out[2] = a[2] / len;
  return out;
}

/** out = a x b (right-handed). */
export function cross3(out: Vec3, a: ArrayLike<number>, b: ArrayLike<number>): Vec3 {
  const x = a[1] * b[2] - a[2] * b[1];
  const y = a[2] * b[0] - a[0] * b[2];
  const z = a[0] * b[1] - a[1] * b[0];
  out[0] = x;
  out[1] = y;
  out[2] = z;
  return out;
}

/** a . b */
export function dot3(a: ArrayLike<number>, b: ArrayLike<number>): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

/** Unit vector of J2000 right ascension and declination (degrees), hole/equatorial frame. */
export function unitFromRaDec(out: Vec3, raDeg: number, decDeg: number): Vec3 {
  const ra = (raDeg * Math.PI) / 180;
  const dec = (decDeg * Math.PI) / 180;
  out[0] = Math.cos(dec) * Math.cos(ra);
  out[1] = Math.cos(dec) * Math.sin(ra);
  out[2] = Math.sin(dec);
  return out;
}
