import { describe, expect, it } from 'vitest';
import { RayTable, createRayLookup } from '@/lib/relativity';
import { GeodesicRayTracer, renderBandBruteForce, createBruteForceTracer } from '@/lib/render/bruteForce';
import { prepareFrame } from '@/lib/render/frame';
import { renderBandLinear } from '@/lib/render/renderRows';
import { parseFrameRequest } from '@/lib/render/schema';
import { loadMilkyWayMap, loadStarCatalogue } from '@/lib/render/node/assets';
import { UNIT_EXPOSURE_EV, close, luminance } from './helpers';

const DEG = Math.PI / 180;

describe('GeodesicRayTracer', () => {
  it('should agree with the engine ray table to 1e-7 rad in phi for hovering, falling and in-horizon cameras', () => {
    // The brute force integrates d^2u/dphi^2 = 3u^2 - u with odex (Hairer & Wanner GBS, npm registry);
    // the table holds the exact Carlson-integral azimuth (physics.md section 5). They must agree
    // wherever phi is not singular: away from the shadow edge (Bozza 2002 log divergence) and the
    // in-horizon E = 0 kink, checked on 120 look angles per camera.
    const cameras = [
      { r: 10, eps: Math.sqrt(0.8), ur: 0 },
      { r: 3.3, eps: Math.sqrt(1 - 2 / 3.3), ur: 0 },
      { r: 1.98, eps: 0.9, ur: -Math.sqrt(0.81 - (1 - 2 / 1.98)) },
    ];
    for (const { r, eps, ur } of cameras) {
      const table = RayTable.build(r, eps, ur);
      const tracer = new GeodesicRayTracer(r, eps, ur);
      const exact = createRayLookup();
      const brute = createRayLookup();
      let worstPhi = 0;
      let worstSlope = 0;
      let checked = 0;
      for (let i = 0; i < 120; i++) {
        const psi = ((i + 0.5) / 120) * Math.PI;
        if (Math.abs(psi - table.shadowEdgePsi) < 0.02 || Math.abs(psi - table.horizonImagePsi) < 0.02) continue;
        table.lookup(psi, exact);
        tracer.trace(psi, Math.cos(psi), brute);
        expect(brute.fate, `fate r=${r} psi=${psi}`).toBe(exact.fate);
        worstPhi = Math.max(worstPhi, Math.abs(brute.phi - exact.phi));
        worstSlope = Math.max(worstSlope, Math.abs(brute.dPhiDPsi - exact.dPhiDPsi) / Math.max(1, Math.abs(exact.dPhiDPsi)));
        expect(close(brute.g, exact.g, 1e-12)).toBe(true);
        checked++;
      }
      console.log(`r=${r}: ${checked} rays, worst |dphi| ${worstPhi.toExponential(2)} rad, worst relative d(dphi/dpsi) ${worstSlope.toExponential(2)}`);
      expect(checked).toBeGreaterThan(100);
      expect(worstPhi).toBeLessThan(1e-7);
      expect(worstSlope).toBeLessThan(1e-4);
    }
  });

  it('should reject bad arguments with RangeError', () => {
    expect(() => new GeodesicRayTracer(Number.NaN, 1, 0)).toThrow(RangeError);
    expect(() => new GeodesicRayTracer(10, 1, 0)).toThrow(RangeError); // not a unit radial observer at r = 10
    expect(() => new GeodesicRayTracer(10, Math.sqrt(0.8), 0).trace(4, Math.cos(4), createRayLookup())).toThrow(RangeError);
  });
});

describe('renderBandBruteForce', () => {
  it('should match the table-based render of a 48x48 dome at r = 10 pixel for pixel outside the shadow edge', () => {
    // Same frame (hovering at r = 10, looking at the hole, catalogue stars, Milky Way, horizon grid,
    // tone mapping off so values are radiance), once through the ray table and once with every
    // pixel's geodesic integrated. Pixels within 1.5 px of the shadow edge are left out: there phi
    // diverges (Bozza 2002) and a pixel's fate can flip on 1e-9 rad. The edge is placed by Synge's
    // formula sin(alpha) = 3 sqrt(3) sqrt(1 - 2/r) / r (Synge 1966, MNRAS 131, 463), independently
    // of both renderers.
    const r = 10;
    const size = 48;
    const req = parseFrameRequest({
      camera: { state: { kind: 'hover', radiusM: r } },
      projection: { kind: 'dome', apertureDeg: 180 },
      width: size,
      height: size,
      exposure: { ev: UNIT_EXPOSURE_EV, toneMap: 'none' },
    });
    const plan = prepareFrame(req, { catalogue: loadStarCatalogue(), milkyWay: loadMilkyWayMap() });
    const table = renderBandLinear(plan, { y0: 0, y1: size });
    const tracer = createBruteForceTracer(plan)!;
    const brute = renderBandBruteForce(plan, { y0: 0, y1: size }, tracer);
    const alpha = Math.asin((3 * Math.sqrt(3) * Math.sqrt(1 - 2 / r)) / r);
    const radPerPx = (90 * DEG) / (size / 2);
    let compared = 0;
    let skipped = 0;
    let worst = 0;
    let lit = 0;
    for (let y = 0; y < size; y++) {
      for (let x = 0; x < size; x++) {
        const theta = Math.hypot(x + 0.5 - size / 2, y + 0.5 - size / 2) * radPerPx; // angle from the hole direction
        if (Math.abs(theta - alpha) < 1.5 * radPerPx) {
          skipped++;
          continue;
        }
        const i = y * size + x;
        for (let c = 0; c < 3; c++) {
          const a = table[3 * i + c];
          const b = brute[3 * i + c];
          const error = Math.abs(a - b) / Math.max(1e-3, Math.abs(a));
          worst = Math.max(worst, error);
        }
        if (luminance(table, i) > 0) lit++;
        compared++;
      }
    }
    console.log(
      `brute force vs table: ${compared} pixels compared (${lit} lit), ${skipped} at the shadow edge skipped, ` +
        `worst relative difference ${worst.toExponential(2)}; ${tracer.rays} geodesics, ${(tracer.steps / tracer.rays).toFixed(1)} odex steps each`,
    );
    expect(compared).toBeGreaterThan(1700);
    expect(lit).toBeGreaterThan(1000);
    expect(worst).toBeLessThan(1e-4);
  }, 60_000);
});
