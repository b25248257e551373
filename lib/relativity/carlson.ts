/**
 * Carlson's symmetric elliptic integral of the first kind, R_F, by the
 * duplication algorithm of Carlson (1995), Numer. Algorithms 10, 13, section 2.
 */

// Relative-error parameter r of Carlson (1995) eq. (2.2): the remainder of the
// fifth-order series is then below ~1e-16 relative, i.e. double precision.
const CARLSON_R = 1e-16;
const CARLSON_Q_FACTOR = Math.pow(3 * CARLSON_R, -1 / 6);
const MAX_DUPLICATIONS = 60;

/**
 * R_F(x, y, z) = (1/2) * integral_0^inf dt / sqrt((t+x)(t+y)(t+z)).
 * @param x non-negative real
 * @param y non-negative real
 * @param z non-negative real; at most one of x, y, z may be zero
 * @returns the integral (dimension: argument^-1/2); Infinity if two arguments are zero
 * Reference: Carlson 1995, algorithm (2.2)-(2.5). Internal: callers guarantee the ranges.
 */
export function carlsonRF(x: number, y: number, z: number): number {
  let xm = x;
  let ym = y;
  let zm = z;
  let am = (x + y + z) / 3;
  let q = CARLSON_Q_FACTOR * Math.max(Math.abs(am - x), Math.abs(am - y), Math.abs(am - z));
  // Duplication (Carlson 1995 eq. 2.3): each step shrinks the spread by four.
  for (let m = 0; m < MAX_DUPLICATIONS && q >= Math.abs(am); m++) {
    const sx = Math.sqrt(xm);
    const sy = Math.sqrt(ym);
    const sz = Math.sqrt(zm);
    const lambda = sx * sy + sx * sz + sy * sz;
    xm = (xm + lambda) * 0.25;
    ym = (ym + lambda) * 0.25;
    zm = (zm + lambda) * 0.25;
    am = (am + lambda) * 0.25;
    q *= 0.25;
  }
  if (!(am > 0)) return Infinity;
  // Carlson 1995 eq. (2.4)-(2.5): X = (A0 - x)/(4^m A_m) = (A_m - x_m)/A_m.
  const X = (am - xm) / am;
  const Y = (am - ym) / am;
  const Z = -(X + Y);
  const e2 = X * Y - Z * Z;
  const e3 = X * Y * Z;
  return (1 - e2 / 10 + e3 / 14 + (e2 * e2) / 24 - (3 * e2 * e3) / 44) / Math.sqrt(am);
}
