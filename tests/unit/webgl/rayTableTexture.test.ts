import { describe, expect, it } from 'vitest';
import { buildRayTableForRadialObserver, observeRay, FATE_SKY } from '@/lib/relativity';
import { lookupPackedRayTable, packRayTable, type PackedLookup } from '@/lib/webgl/rayTableTexture';
import { expectClose } from './close';

const rec = (): PackedLookup => ({ fate: 0, phi: 0, dPhiDPsi: 0, g: 0 });

/** Look angle where the packed table's fate changes from sky to horizon (bisection). */
function edgeOf(table: ReturnType<typeof packRayTable>, lo: number, hi: number): number {
  const r = rec();
  for (let i = 0; i < 60; i++) {
    const mid = 0.5 * (lo + hi);
    if (lookupPackedRayTable(table, mid, r).fate === FATE_SKY) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

describe('lookupPackedRayTable', () => {
  it('should put the shadow edge of a hovering camera where Synge 1966 puts it', () => {
    for (const r of [3.5, 7, 20]) {
      const table = packRayTable(buildRayTableForRadialObserver(r, null).toArrays());
      // Synge 1966, MNRAS 131, 463: sin(alpha) = 3 sqrt(3) sqrt(1 - 2/r) / r, alpha from the direction to the hole
      const alpha = Math.asin((3 * Math.sqrt(3) * Math.sqrt(1 - 2 / r)) / r);
      const psiEdge = Math.PI - alpha;
      const found = edgeOf(table, 0.5 * Math.PI, Math.PI);
      console.log(`r = ${r}: edge error ${Math.abs(found - psiEdge).toExponential(2)} rad`);
      // float32 storage of the segment anchors bounds the accuracy (about 1e-7 relative)
      expectClose(found, psiEdge, 1e-6, `r = ${r}`);
    }
  });

  it('should tend to phi = psi far from the hole (flat-space check of physics.md section 5)', () => {
    // a hovering camera: a falling one at 1e7 M moves at sqrt(2M/r) = 4.5e-4 c and sees that much aberration
    const table = packRayTable(buildRayTableForRadialObserver(1e7, null).toArrays());
    const r = rec();
    let worst = 0;
    for (let psi = 0.05; psi < 3.1; psi += 0.05) {
      lookupPackedRayTable(table, psi, r);
      // bound: the whole weak-field deflection 4M/b (Epstein & Shapiro 1980) at b = r sin(psi)/sqrt(f),
      // plus float32 rounding (~1e-6 rad)
      const bound = 4 / ((1e7 * Math.sin(psi)) / Math.sqrt(1 - 2e-7)) + 1e-6;
      worst = Math.max(worst, Math.abs(r.phi - psi) / bound);
    }
    console.log(`flat limit: worst |phi - psi| / bound ${worst.toFixed(3)}`);
    expect(worst).toBeLessThan(1);
  });

  it('should give g = 1/sqrt(1 - 2M/r) for a hovering camera (physics.md section 5, hovering shift)', () => {
    const rr = 7;
    const table = packRayTable(buildRayTableForRadialObserver(rr, null).toArrays());
    const out = lookupPackedRayTable(table, 1, rec());
    expectClose(out.g, 1 / Math.sqrt(1 - 2 / rr), 1e-6);
  });

  it('should agree with the engine tracer away from fate boundaries (consistency with lib/relativity observeRay)', () => {
    const cases = [
      { r: 7, observer: { kind: 'static' } as const, energy: null },
      { r: 2.4, observer: { kind: 'radial', energy: 1 } as const, energy: 1 },
      { r: 1, observer: { kind: 'radial', energy: 1 } as const, energy: 1 },
    ];
    const out = rec();
    for (const c of cases) {
      const engineTable = buildRayTableForRadialObserver(c.r, c.energy);
      const packed = packRayTable(engineTable.toArrays());
      const edges = [engineTable.shadowEdgePsi, engineTable.horizonImagePsi].filter(Number.isFinite);
      let worst = 0;
      for (let psi = 0.013; psi < Math.PI; psi += 0.031) {
        if (edges.some((e) => Math.abs(psi - e) < 1e-3)) continue;
        const exact = observeRay(c.r, psi, c.observer);
        lookupPackedRayTable(packed, psi, out);
        const fate = exact.fate === 'sky' ? 0 : exact.fate === 'horizon' ? 1 : 2;
        expect(out.fate, `r = ${c.r}, psi = ${psi}`).toBe(fate);
        // float32 look angles (~1e-7 rad, as on the GPU) are amplified by the slope near the shadow edge
        const tolerance = 1e-5 + 1e-6 * Math.abs(out.dPhiDPsi);
        worst = Math.max(worst, Math.abs(out.phi - exact.phi) / tolerance);
      }
      console.log(`r = ${c.r}: worst |phi - exact| / tolerance ${worst.toFixed(3)}`);
      expect(worst).toBeLessThan(1);
    }
  });

  it('should reject a layout that is not the RayTable format', () => {
    const arrays = buildRayTableForRadialObserver(7, null).toArrays();
    const broken = { ...arrays, layout: arrays.layout.slice(0, arrays.layout.length - 1) };
    expect(() => packRayTable(broken)).toThrow(RangeError);
    const table = packRayTable(arrays);
    expect(() => lookupPackedRayTable(table, 4, rec())).toThrow(RangeError);
  });
});

describe('packRayTable', () => {
  it('should carry node i and node i + 1 in texel i, so one fetch serves a cubic step', () => {
    const arrays = buildRayTableForRadialObserver(5, null).toArrays();
    const table = packRayTable(arrays);
    const total = arrays.phi.length;
    for (let i = 0; i < total; i++) {
      const next = Math.min(i + 1, total - 1);
      expect(table.nodes[4 * i]).toBe(Math.fround(arrays.phi[i]));
      expect(table.nodes[4 * i + 1]).toBe(Math.fround(arrays.slope[i]));
      expect(table.nodes[4 * i + 2]).toBe(Math.fround(arrays.phi[next]));
      expect(table.nodes[4 * i + 3]).toBe(Math.fround(arrays.slope[next]));
    }
  });

  it('should give each segment an upper bound so that the bounds below psi count up to the segment of lib/relativity layout holding psi', () => {
    for (const [r, energy] of [[7, null], [2.4, 1], [1, 1]] as const) {
      const arrays = buildRayTableForRadialObserver(r, energy).toArrays();
      const table = packRayTable(arrays);
      const L = arrays.layout;
      const count = L[3];
      for (let psi = 0.001; psi < Math.PI; psi += 0.0173) {
        const p = Math.fround(psi);
        let below = 0;
        for (const hi of table.segmentHi) if (p > hi) below++;
        // layout record k (lib/relativity/rayTable.ts toArrays): map, psiLo, psiHi, ...; the first segment with psi <= psiHi
        let expected = 0;
        while (expected < count - 1 && p > Math.fround(L[6 + 9 * expected + 2])) expected++;
        expect(below, `r = ${r}, psi = ${psi}`).toBe(expected);
      }
      // the last segment in use and the unused slots never count
      for (let k = count - 1; k < table.segmentHi.length; k++) expect(table.segmentHi[k]).toBeGreaterThan(Math.PI);
    }
  });
});
