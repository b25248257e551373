import { describe, expect, it } from 'vitest';
import { buildRayTableForRadialObserver, createRayLookup, observeRay, RayTable } from '@/lib/relativity';
import { expectClose } from './support/tolerance';

/** The error bound stated in lib/relativity/README.md for lookups outside the shadow-edge band. */
const TABLE_PHI_BOUND_RAD = 1e-7;
const EDGE_BAND_RAD = 1e-6;
const FATES = ['sky', 'horizon', 'far-side'];

const CAMERAS: [number, number | null][] = [
  [1000, null], [30, null], [6, null], [3.5, null], [3, null], [2.5, null], [2.01, null],
  [10, 1], [3, 1], [2.0001, 1], [2, 1], [1.5, 1], [0.5, 1], [1.5, 0.3], [0.1, 1], [2.5, 2], [10, 5],
];

describe('RayTable.lookup', () => {
  it('should reproduce observeRay within the stated bound outside the shadow-edge band', () => {
    // Reference: the exact tracer observeRay (itself checked against odex and the published values).
    const out = createRayLookup();
    let worst = 0;
    for (const [r, energy] of CAMERAS) {
      const table = buildRayTableForRadialObserver(r, energy);
      const observer = energy === null ? ({ kind: 'static' } as const) : ({ kind: 'radial', energy } as const);
      for (let i = 0; i < 4000; i++) {
        const psi = (Math.PI * (i + 0.37)) / 4000;
        if (Math.abs(psi - table.shadowEdgePsi) < EDGE_BAND_RAD) continue;
        const exact = observeRay(r, psi, observer);
        table.lookup(psi, out);
        expect(FATES[out.fate]).toBe(exact.fate);
        worst = Math.max(worst, Math.abs(out.phi - exact.phi));
        expectClose(out.g, exact.g, 1e-12 * exact.g, 'g');
      }
    }
    console.log(`ray table vs observeRay: worst |dphi| = ${worst.toExponential(2)} rad (bound ${TABLE_PHI_BOUND_RAD})`);
    expect(worst).toBeLessThan(TABLE_PHI_BOUND_RAD);
  });

  it('should resolve the logarithmic wrap next to the shadow edge', () => {
    // Bozza 2002: phi ~ -log|b - b_c| near the edge; the table follows it down to 1e-6 rad from the edge.
    const out = createRayLookup();
    const table = buildRayTableForRadialObserver(8, null);
    for (const d of [1e-6, 1e-5, 1e-4, 1e-3]) {
      for (const psi of [table.shadowEdgePsi - d, table.shadowEdgePsi + d]) {
        table.lookup(psi, out);
        expectClose(out.phi, observeRay(8, psi, { kind: 'static' }).phi, 2 * TABLE_PHI_BOUND_RAD, `phi at ${d} from the edge`);
      }
    }
  });

  it('should read the smooth break where k^r = 0 (psi = pi/2 for a hovering camera) without NaN, to the stated bound', () => {
    // Reference: the exact tracer observeRay; its dphi/dpsi by a central difference with a 1e-5 rad step
    // (observeRay's phi carries ~4e-9 rad of roundoff next to k^r = 0, so smaller steps are noise). The
    // derivative only sizes pixel footprints and the Jacobian, so 1e-3 relative is ample (common practice).
    const out = createRayLookup();
    for (const r of [5, 3.2, 30]) {
      const table = buildRayTableForRadialObserver(r, null);
      const exactPhi = (psi: number) => observeRay(r, psi, { kind: 'static' }).phi;
      const h = 1e-5;
      const slope = (exactPhi(Math.PI / 2 + h) - exactPhi(Math.PI / 2 - h)) / (2 * h);
      for (const offset of [0, 1e-15, -1e-15, 1e-11, -1e-11, 1e-9, -1e-9, 1e-7, -1e-7]) {
        const psi = Math.PI / 2 + offset;
        table.lookup(psi, out);
        expect(Number.isFinite(out.phi) && Number.isFinite(out.dPhiDPsi) && Number.isFinite(out.jacobian), `r = ${r}, offset ${offset}`).toBe(true);
        expectClose(out.phi, exactPhi(psi), TABLE_PHI_BOUND_RAD, `phi at r = ${r}, psi = pi/2 + ${offset}`);
        expectClose(out.dPhiDPsi, slope, 1e-3 * Math.abs(slope), `dphi/dpsi at r = ${r}, psi = pi/2 + ${offset}`);
      }
    }
  });

  it('should stay finite exactly on the shadow edge, where phi diverges', () => {
    // Bozza 2002: phi grows like -log|psi - psi_edge|; an exact hit is read 1e-300 rad away.
    const out = createRayLookup();
    for (const [r, energy] of CAMERAS) {
      const table = buildRayTableForRadialObserver(r, energy);
      if (!Number.isFinite(table.shadowEdgePsi)) continue;
      table.lookup(table.shadowEdgePsi, out);
      expect(Number.isFinite(out.phi) && Number.isFinite(out.dPhiDPsi), `r = ${r}`).toBe(true);
    }
  });

  it('should be continuous across r = 2 for a falling observer', () => {
    // Property (physics.md section 8): the view of a falling camera is continuous through the horizon.
    const out = createRayLookup();
    const outside = buildRayTableForRadialObserver(2 + 1e-9, 1);
    const inside = buildRayTableForRadialObserver(2 - 1e-9, 1);
    const a = createRayLookup();
    for (let i = 1; i < 200; i++) {
      const psi = (i / 200) * 2.3;
      outside.lookup(psi, out);
      inside.lookup(psi, a);
      expect(a.fate).toBe(out.fate);
      expectClose(a.phi, out.phi, 1e-5, `phi at psi=${psi}`);
    }
  });

  it('should give the lensing Jacobian sin(psi)/|sin(phi) dphi/dpsi| and tend to 1 far away', () => {
    // physics.md section 6: |dOmega_screen/dOmega_sky|; check dphi/dpsi against a central difference of observeRay.
    const out = createRayLookup();
    const r = 12;
    const table = buildRayTableForRadialObserver(r, null);
    for (const psi of [0.4, 1.2, 2.0]) {
      table.lookup(psi, out);
      const h = 1e-5;
      const derivative = (observeRay(r, psi + h, { kind: 'static' }).phi - observeRay(r, psi - h, { kind: 'static' }).phi) / (2 * h);
      expectClose(out.dPhiDPsi, derivative, 1e-5 * Math.abs(derivative), 'dphi/dpsi (Hermite slope, README bound 1e-5 relative)');
      expectClose(out.jacobian, Math.sin(psi) / Math.abs(Math.sin(out.phi) * derivative), 1e-5 * out.jacobian, 'jacobian');
    }
    const far = buildRayTableForRadialObserver(1e7, null);
    far.lookup(1.0, out);
    expectClose(out.jacobian, 1, 1e-5, 'flat-space Jacobian');
  });

  it('should round-trip through plain typed arrays', () => {
    const table = buildRayTableForRadialObserver(4, 1);
    const { layout, phi, slope } = table.toArrays();
    const copy = RayTable.fromArrays({ layout: layout.slice(), phi: phi.slice(), slope: slope.slice() });
    const a = createRayLookup();
    const b = createRayLookup();
    for (const psi of [0.1, 1, 2, 3]) {
      table.lookup(psi, a);
      copy.lookup(psi, b);
      expect(b).toEqual(a);
    }
    expect(layout).toBeInstanceOf(Float64Array);
  });

  it('should reject an inconsistent observer with a RangeError', () => {
    expect(() => RayTable.build(10, 2, 0)).toThrow(/eps\^2 - ur\^2/);
    expect(() => RayTable.build(1, 0.5, 1)).toThrow(RangeError);
    expect(() => buildRayTableForRadialObserver(1.5, null)).toThrow(/static/);
  });
});
