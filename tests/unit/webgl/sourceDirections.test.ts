import { describe, expect, it } from 'vitest';
import { parseFrameRequest } from '@/lib/render/schema';
import { prepareFrame } from '@/lib/render/frame';
import { createSourceTracer, renderSourceDirections, SOURCE_RECORD_LENGTH, traceSourceDirection } from '@/lib/webgl/sourceDirections';
import { expectClose } from './close';

const DEG = Math.PI / 180;
/** Galactic centre, the request's default hole direction (J2000; IAU 1958 galactic frame, value from memory). */
const GC = { raDeg: 266.405, decDeg: -28.936 };
const unit = (ra: number, dec: number) => [Math.cos(dec * DEG) * Math.cos(ra * DEG), Math.cos(dec * DEG) * Math.sin(ra * DEG), Math.sin(dec * DEG)];

function plan(state: object, extra: object = {}) {
  return prepareFrame(
    parseFrameRequest({ camera: { state }, projection: { kind: 'flat', fovDeg: 60 }, width: 9, height: 9, sky: { stars: { enabled: false }, milkyWay: { enabled: false } }, ...extra }),
    {},
  );
}

describe('traceSourceDirection', () => {
  it('should see the hole direction at the frame centre when lensing is off (flat-space check)', () => {
    const out = traceSourceDirection(createSourceTracer(plan({ kind: 'hover', radiusM: 7 }, { effects: { lensing: false } })), 4.5, 4.5, new Float64Array(SOURCE_RECORD_LENGTH));
    const gc = unit(GC.raDeg, GC.decDeg);
    for (let i = 0; i < 3; i++) expectClose(out[i], gc[i], 1e-12);
    expect(out[9]).toBe(0);
  });

  it('should see the sky unlensed from very far away (phi -> psi, physics.md section 5)', () => {
    const far = traceSourceDirection(createSourceTracer(plan({ kind: 'hover', radiusM: 1e8 })), 1.5, 2.5, new Float64Array(SOURCE_RECORD_LENGTH));
    const flat = traceSourceDirection(createSourceTracer(plan({ kind: 'hover', radiusM: 1e8 }, { effects: { lensing: false } })), 1.5, 2.5, new Float64Array(SOURCE_RECORD_LENGTH));
    const angle = Math.acos(Math.min(1, far[0] * flat[0] + far[1] * flat[1] + far[2] * flat[2]));
    // deflection ~4M/b = 4e-8 rad at b ~ 1e8 M (Epstein & Shapiro 1980)
    expect(angle).toBeLessThan(1e-6);
  });

  it('should find the shadow at the frame centre of a hovering camera looking at the hole', () => {
    const dirs = renderSourceDirections(plan({ kind: 'hover', radiusM: 7 }));
    const centre = 5 * (4 * 9 + 4);
    expect(dirs[centre + 3]).toBe(1); // horizon fate
    expectClose(Math.hypot(dirs[centre], dirs[centre + 1], dirs[centre + 2]), 1, 1e-12);
  });
});
