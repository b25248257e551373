import { describe, expect, it } from 'vitest';
import { observeRay, RayTable, createRayLookup } from '@/lib/relativity';
import { BARE, close, luminance, renderRowsLinear, syntheticCatalogue } from './helpers';

const DEG = Math.PI / 180;
/** Galactic centre, the default hole direction (J2000). */
const HOLE = { raDeg: 266.405, decDeg: -28.936 };

/** Unit J2000 vector (textbook spherical to Cartesian). */
function unit(raDeg: number, decDeg: number): number[] {
  return [Math.cos(decDeg * DEG) * Math.cos(raDeg * DEG), Math.cos(decDeg * DEG) * Math.sin(raDeg * DEG), Math.sin(decDeg * DEG)];
}

/** RA/Dec of a unit vector. */
function raDec(v: number[]): { raDeg: number; decDeg: number } {
  let ra = Math.atan2(v[1], v[0]) / DEG;
  if (ra < 0) ra += 360;
  return { raDeg: ra, decDeg: Math.asin(v[2]) / DEG };
}

describe('renderBandLinear (shadow)', () => {
  it('should match the Synge shadow radius within one pixel at 2048 wide for three hovering radii', () => {
    // Synge 1966, MNRAS 131, 463: sin(alpha) = 3 sqrt(3) sqrt(1 - 2/r) / r (physics.md section 5)
    const width = 2048;
    const fovDeg = 160;
    const f = width / 2 / Math.tan((fovDeg / 2) * DEG);
    for (const r of [4, 6, 20]) {
      const alpha = Math.asin((3 * Math.sqrt(3) * Math.sqrt(1 - 2 / r)) / r);
      const expectedPx = f * Math.tan(alpha);
      const buf = renderRowsLinear(
        { ...BARE, sky: { ...BARE.sky, uniform: { brightness: 1000 } }, camera: { state: { kind: 'hover', radiusM: r } }, projection: { kind: 'flat', fovDeg }, width, height: 2 },
        {},
        0,
        1,
      );
      // row 0 centres sit 0.5 px above the axis; find the last dark pixel right of the centre
      let edge = -1;
      for (let x = width / 2; x < width; x++) if (luminance(buf, x) === 0) edge = x;
      const measured = Math.sqrt((edge + 1 - width / 2) ** 2 + 0.5 ** 2);
      console.log(`shadow r=${r}: measured ${measured.toFixed(2)} px, Synge ${expectedPx.toFixed(2)} px`);
      expect(close(measured, expectedPx, 1)).toBe(true);
    }
  });
});

describe('renderBandLinear (Liouville)', () => {
  it('should show a uniform sky of brightness B as B g^4 outside the shadow for a hovering camera', () => {
    // Liouville: I_nu / nu^3 invariant (MTW section 22.6); hovering g = 1/sqrt(1 - 2/r) (physics.md section 6)
    const r = 10;
    const B = 500;
    const g = 1 / Math.sqrt(1 - 2 / r);
    const buf = renderRowsLinear(
      { ...BARE, sky: { ...BARE.sky, uniform: { brightness: B } }, camera: { state: { kind: 'hover', radiusM: r } }, projection: { kind: 'equirect' }, width: 128, height: 64 },
      {},
    );
    let worst = 0;
    let sky = 0;
    for (let i = 0; i < 128 * 64; i++) {
      const y = luminance(buf, i);
      if (y === 0) continue;
      sky++;
      worst = Math.max(worst, Math.abs(y / (B * g ** 4) - 1));
    }
    console.log(`Liouville: ${sky} sky pixels, worst relative error ${worst.toExponential(2)}`);
    expect(sky).toBeGreaterThan(5000);
    expect(worst).toBeLessThan(0.01);
  });
});

describe('renderBandLinear (Einstein ring)', () => {
  it('should draw a star exactly behind the hole as a ring at the angle where the engine sends phi to pi', () => {
    // physics.md section 5: the source direction is e1 rotated by phi; a star opposite the camera needs phi = pi
    const r = 30;
    let lo = Math.PI / 2;
    let hi = Math.PI - 1e-9;
    // phi grows as psi approaches the shadow edge from outside; bisect phi(psi) = pi with the exact engine
    const edge = Math.PI - Math.asin((3 * Math.sqrt(3) * Math.sqrt(1 - 2 / r)) / r);
    hi = edge - 1e-9;
    for (let k = 0; k < 100; k++) {
      const mid = 0.5 * (lo + hi);
      if (observeRay(r, mid, { kind: 'static' }).phi < Math.PI) lo = mid;
      else hi = mid;
    }
    const ringAngle = Math.PI - 0.5 * (lo + hi); // angle from the direction to the hole
    const width = 256;
    const fovDeg = 2.6 * (ringAngle / DEG);
    const f = width / 2 / Math.tan((fovDeg / 2) * DEG);
    const expectedPx = f * Math.tan(ringAngle);
    const behind = raDec(unit(HOLE.raDeg, HOLE.decDeg)); // the hole direction, seen from the camera
    const buf = renderRowsLinear(
      {
        ...BARE,
        sky: { ...BARE.sky, stars: { enabled: true, sourceSizeArcsec: 20 } },
        camera: { state: { kind: 'hover', radiusM: r }, holeDirection: HOLE },
        projection: { kind: 'flat', fovDeg },
        width,
        height: width,
      },
      { catalogue: syntheticCatalogue([{ ...behind, mag: 0 }]) },
    );
    // brightness-weighted radius in each of 8 directions, restricted to the outer (primary) ring
    const radii: number[] = [];
    for (let k = 0; k < 8; k++) {
      const a = (k * Math.PI) / 4 + 0.1;
      let wsum = 0;
      let rsum = 0;
      for (let s = expectedPx * 0.8; s < expectedPx * 1.2; s += 0.05) {
        const x = Math.floor(width / 2 + s * Math.cos(a));
        const y = Math.floor(width / 2 - s * Math.sin(a));
        const w = luminance(buf, y * width + x);
        wsum += w;
        rsum += w * s;
      }
      radii.push(rsum / wsum);
    }
    const mean = radii.reduce((p, q) => p + q, 0) / radii.length;
    console.log(`Einstein ring: measured ${mean.toFixed(2)} px (min ${Math.min(...radii).toFixed(2)}, max ${Math.max(...radii).toFixed(2)}), engine ${expectedPx.toFixed(2)} px`);
    for (const rad of radii) expect(close(rad, expectedPx, 1)).toBe(true);
  });
});

describe('renderBandLinear (point-star flux)', () => {
  it('should give an isolated star image a total flux of catalogue flux x g^4 x Jacobian within 5%', () => {
    // physics.md section 6: flux = F x g^4 x |dOmega_screen/dOmega_sky|; Pogson: F = 10^(-0.4 m)
    const r = 12;
    const g = 1 / Math.sqrt(1 - 2 / r);
    // a star 40 degrees from the hole direction, as seen from the hole
    const towardHole = unit(HOLE.raDeg, HOLE.decDeg);
    const e1 = towardHole.map((c) => -c);
    const north = [0, 0, 1];
    const k = north[0] * e1[0] + north[1] * e1[1] + north[2] * e1[2];
    const e3raw = north.map((c, i) => c - k * e1[i]);
    const n3 = Math.hypot(...e3raw);
    const e3 = e3raw.map((c) => c / n3);
    const theta = 140 * DEG; // angle from e1 (outward): the star lies 40 degrees from the hole direction
    const starDir = e1.map((c, i) => Math.cos(theta) * c + Math.sin(theta) * e3[i]);
    // find the primary image psi with the exact engine: phi(psi) = theta, psi on the far side of the shadow edge
    const edge = Math.PI - Math.asin((3 * Math.sqrt(3) * Math.sqrt(1 - 2 / r)) / r);
    let lo = 0;
    let hi = edge - 1e-9;
    for (let it = 0; it < 100; it++) {
      const mid = 0.5 * (lo + hi);
      if (observeRay(r, mid, { kind: 'static' }).phi < theta) lo = mid;
      else hi = mid;
    }
    const psi = 0.5 * (lo + hi);
    const table = RayTable.build(r, Math.sqrt(1 - 2 / r), 0);
    const jac = table.lookup(psi, createRayLookup()).jacobian;
    // look straight at the image: look vector = (cos psi, 0, sin psi) in (e1, e2, e3)
    const width = 96;
    const fovDeg = 3;
    const buf = renderRowsLinear(
      {
        ...BARE,
        sky: { ...BARE.sky, stars: { enabled: true } },
        camera: { state: { kind: 'hover', radiusM: r }, holeDirection: HOLE, look: [Math.cos(psi), 0, Math.sin(psi)], up: [0, 1, 0] },
        projection: { kind: 'flat', fovDeg },
        width,
        height: width,
      },
      { catalogue: syntheticCatalogue([{ ...raDec(starDir), mag: 1 }]) },
    );
    const f = width / 2 / Math.tan((fovDeg / 2) * DEG);
    let flux = 0;
    for (let y = 0; y < width; y++) {
      for (let x = 0; x < width; x++) {
        const dx = (x + 0.5 - width / 2) / f;
        const dy = (y + 0.5 - width / 2) / f;
        const omega = 1 / (f * f * (1 + dx * dx + dy * dy) ** 1.5); // pinhole pixel solid angle
        flux += luminance(buf, y * width + x) * omega;
      }
    }
    const expected = Math.pow(10, -0.4) * g ** 4 * jac;
    console.log(`star flux: measured ${flux.toExponential(4)}, F g^4 J = ${expected.toExponential(4)} (J = ${jac.toFixed(4)})`);
    expect(Math.abs(flux / expected - 1)).toBeLessThan(0.05);
  });
});
