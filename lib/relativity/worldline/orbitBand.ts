/** Orbit band of a radius (physics.md section 2). */
import type { OrbitBand } from './types';

/**
 * The orbit band a radius lies in.
 * @param r radius in M (> 0)
 * @returns 'stable orbits' (r >= 6), 'unstable orbits' (3 < r < 6), 'no orbits' (2 < r <= 3), 'interior' (r <= 2)
 * Reference: Bardeen, Press & Teukolsky 1972; physics.md section 2.
 */
export function orbitBand(r: number): OrbitBand {
  if (!(Number.isFinite(r) && r > 0)) throw new RangeError(`r must be a finite radius > 0 in units of M; got ${r}`);
  if (r >= 6) return 'stable orbits';
  if (r > 3) return 'unstable orbits';
  if (r > 2) return 'no orbits';
  return 'interior';
}
