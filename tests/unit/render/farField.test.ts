import { describe, expect, it } from 'vitest';
import * as Astronomy from 'astronomy-engine';
import { loadStarCatalogue } from '@/lib/render/node/assets';
import { BARE, luminance, renderRowsLinear } from './helpers';

/** Orion's belt region: the hole sits in front of it, 1e7 M away. */
const HOLE = { raDeg: 83.82, decDeg: -5.39 };

/** J2000 unit vector through astronomy-engine (independent of lib/render's conversions). */
function vec(raDeg: number, decDeg: number): number[] {
  const v = Astronomy.VectorFromSphere(new Astronomy.Spherical(decDeg, raDeg, 1), Astronomy.MakeTime(new Date(Date.UTC(2000, 0, 1, 12))));
  return [v.x, v.y, v.z];
}

const dot = (a: number[], b: number[]) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross = (a: number[], b: number[]) => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];

describe('renderBandLinear (far from the hole)', () => {
  it('should put bright catalogue stars on the pixels of an independent gnomonic projection at r = 1e7', () => {
    const width = 512;
    const height = 512;
    const fovDeg = 50;
    const buf = renderRowsLinear(
      {
        ...BARE,
        sky: { ...BARE.sky, stars: { enabled: true } },
        camera: { state: { kind: 'hover', radiusM: 1e7 }, holeDirection: HOLE },
        projection: { kind: 'flat', fovDeg },
        width,
        height,
      },
      { catalogue: loadStarCatalogue() },
    );
    // camera basis by the textbook construction: centre towards the hole, up = celestial north made orthogonal,
    // right = centre x up (right-handed sky seen from inside)
    const c = vec(HOLE.raDeg, HOLE.decDeg);
    const k = c[2];
    const upRaw = [-k * c[0], -k * c[1], 1 - k * c[2]];
    const n = Math.hypot(...upRaw);
    const up = upRaw.map((v) => v / n);
    const right = cross(c, up);
    const f = width / 2 / Math.tan(((fovDeg / 2) * Math.PI) / 180);
    // bright stars (J2000 from the Hipparcos catalogue values of SIMBAD; value from memory): Betelgeuse, Rigel, Bellatrix, Alnilam, Saiph
    const stars = [
      { name: 'Betelgeuse', raDeg: 88.7929, decDeg: 7.4071 },
      { name: 'Rigel', raDeg: 78.6345, decDeg: -8.2016 },
      { name: 'Bellatrix', raDeg: 81.2828, decDeg: 6.3497 },
      { name: 'Alnilam', raDeg: 84.0534, decDeg: -1.2019 },
      { name: 'Saiph', raDeg: 86.9391, decDeg: -9.6696 },
    ];
    for (const s of stars) {
      const d = vec(s.raDeg, s.decDeg);
      const z = dot(d, c);
      const px = width / 2 + (f * dot(d, right)) / z;
      const py = height / 2 - (f * dot(d, up)) / z;
      // brightness-weighted centroid within 3 px of the prediction
      let w = 0;
      let sx = 0;
      let sy = 0;
      for (let y = Math.floor(py) - 3; y <= Math.floor(py) + 3; y++) {
        for (let x = Math.floor(px) - 3; x <= Math.floor(px) + 3; x++) {
          const l = luminance(buf, y * width + x);
          w += l;
          sx += l * (x + 0.5);
          sy += l * (y + 0.5);
        }
      }
      const err = Math.hypot(sx / w - px, sy / w - py);
      console.log(`${s.name}: predicted (${px.toFixed(2)}, ${py.toFixed(2)}), rendered centroid off by ${err.toFixed(3)} px`);
      expect(w).toBeGreaterThan(0);
      expect(err).toBeLessThan(1);
    }
  });
});
