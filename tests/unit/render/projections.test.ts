import { describe, expect, it } from 'vitest';
import { createProjector } from '@/lib/render/projections';
import { viewToCameraMatrix } from '@/lib/render/orientation';
import { parseFrameRequest } from '@/lib/render/schema';
import { close } from './helpers';

const DEG = Math.PI / 180;

/** Pixel of a camera-frame direction through a request's orientation and projection. */
function pixelOf(input: Parameters<typeof parseFrameRequest>[0], dir: number[]): [number, number] | null {
  const req = parseFrameRequest(input);
  const m = viewToCameraMatrix(req); // columns right, top, centre (orthonormal): view = M^T dir
  const v = [0, 1, 2].map((c) => m[c] * dir[0] + m[3 + c] * dir[1] + m[6 + c] * dir[2]);
  const out = new Float64Array(2);
  const p = createProjector(req.projection, req.width, req.height);
  return p.viewToPixel(out, v[0], v[1], v[2]) ? [out[0], out[1]] : null;
}

const camera = { state: { kind: 'hover' as const, radiusM: 10 }, look: [0, 0, 1] as [number, number, number], up: [1, 0, 0] as [number, number, number] };
// In the camera frame (e1, e2, e3), look = e3 and up = e1, so right = look x up = e3 x e1 = e2.

describe('createProjector', () => {
  it('should put the zenith (look direction) at the centre of an untilted dome master', () => {
    // physics.md section 7: zenith at the centre (fulldome trade convention, common practice)
    const p = pixelOf({ camera, projection: { kind: 'dome' }, width: 1000, height: 1000 }, [0, 0, 1])!;
    expect(close(p[0], 500, 1e-9) && close(p[1], 500, 1e-9)).toBe(true);
  });

  it('should put the front of the dome at the bottom centre and left on the left', () => {
    // physics.md section 7: front of the dome at the bottom centre, left on the left seen from inside
    // front = -up = -e1 on the dome's spring line (90 degrees from zenith): bottom edge of a 180-degree master
    const front = pixelOf({ camera, projection: { kind: 'dome' }, width: 1000, height: 1000 }, [-1, 0, 0])!;
    expect(close(front[0], 500, 1e-9) && close(front[1], 1000, 1e-9)).toBe(true);
    // facing the front (-e1) with the zenith (e3) overhead, the audience's left is zenith x front... = e3 x (-e1) = -e2
    const left = pixelOf({ camera, projection: { kind: 'dome' }, width: 1000, height: 1000 }, [0, -1, 0])!;
    expect(close(left[0], 0, 1e-9) && close(left[1], 500, 1e-9)).toBe(true);
  });

  it('should move the look direction tiltDeg above the centre of a tilted dome', () => {
    // a tilted dome's frame centre turns towards the front; equidistant fisheye: 180 deg across 1000 px
    const p = pixelOf({ camera, projection: { kind: 'dome', tiltDeg: 30 }, width: 1000, height: 1000 }, [0, 0, 1])!;
    expect(close(p[0], 500, 1e-9) && close(p[1], 500 - (30 / 90) * 500, 1e-9)).toBe(true);
  });

  it('should place a direction 45 degrees from the zenith halfway to the rim of a 180-degree dome', () => {
    // azimuthal equidistant: distance from centre proportional to angle from zenith (physics.md section 7)
    const d = [Math.sin(45 * DEG), 0, Math.cos(45 * DEG)]; // towards up (e1) = top of frame
    const p = pixelOf({ camera, projection: { kind: 'dome' }, width: 1000, height: 1000 }, d)!;
    expect(close(p[0], 500, 1e-9) && close(p[1], 250, 1e-9)).toBe(true);
    const wide = pixelOf({ camera, projection: { kind: 'dome', apertureDeg: 220 }, width: 1100, height: 1100 }, d)!;
    expect(close(wide[1], 550 - (45 / 110) * 550, 1e-9)).toBe(true);
  });

  it('should map a flat frame by the pinhole (gnomonic) formula x = f tan(theta)', () => {
    // rectilinear projection, textbook gnomonic formula; f = (W/2) / tan(fov/2)
    const f = 400 / Math.tan(30 * DEG);
    const d = [0, Math.sin(20 * DEG), Math.cos(20 * DEG)]; // towards e2 = right
    const p = pixelOf({ camera, projection: { kind: 'flat', fovDeg: 60 }, width: 800, height: 600 }, d)!;
    expect(close(p[0], 400 + f * Math.tan(20 * DEG), 1e-9) && close(p[1], 300, 1e-9)).toBe(true);
  });

  it('should map equirectangular longitude and latitude linearly', () => {
    // equirectangular 360 x 180: x proportional to longitude, y to latitude (common practice)
    const right90 = pixelOf({ camera, projection: { kind: 'equirect' }, width: 720, height: 360 }, [0, 1, 0])!;
    expect(close(right90[0], 540, 1e-9) && close(right90[1], 180, 1e-9)).toBe(true);
    const up30 = pixelOf({ camera, projection: { kind: 'equirect' }, width: 720, height: 360 }, [Math.sin(30 * DEG), 0, Math.cos(30 * DEG)])!;
    expect(close(up30[0], 360, 1e-9) && close(up30[1], 120, 1e-9)).toBe(true);
  });

  it('should make neighbouring cube faces meet along their shared edges', () => {
    // cube map continuity (common practice): a direction on the front/right edge lies on both faces' borders
    const size = 512;
    for (const t of [-0.8, -0.3, 0, 0.5, 0.9]) {
      const dir = [t / Math.hypot(1, 1, t), 1 / Math.hypot(1, 1, t), 1 / Math.hypot(1, 1, t)]; // e1 = up component t, e2 = right, e3 = front
      const front = pixelOf({ camera, projection: { kind: 'cubeFace', face: 'front' }, width: size, height: size }, dir)!;
      const right = pixelOf({ camera, projection: { kind: 'cubeFace', face: 'right' }, width: size, height: size }, dir)!;
      expect(close(front[0], size, 1e-9)).toBe(true);
      expect(close(right[0], 0, 1e-9)).toBe(true);
      expect(close(front[1], right[1], 1e-9)).toBe(true);
    }
    const up = pixelOf({ camera, projection: { kind: 'cubeFace', face: 'up' }, width: size, height: size }, [1, 0.2, 1].map((v) => v / Math.hypot(1, 0.2, 1)))!;
    const front = pixelOf({ camera, projection: { kind: 'cubeFace', face: 'front' }, width: size, height: size }, [1, 0.2, 1].map((v) => v / Math.hypot(1, 0.2, 1)))!;
    expect(close(up[1], size, 1e-9) && close(front[1], 0, 1e-9) && close(up[0], front[0], 1e-9)).toBe(true);
  });

  it('should round-trip pixels through directions for every projection', () => {
    const kinds = [
      { kind: 'flat' as const, fovDeg: 75 },
      { kind: 'dome' as const, apertureDeg: 210 },
      { kind: 'equirect' as const },
      { kind: 'cubeFace' as const, face: 'down' as const },
    ];
    const v = new Float64Array(3);
    const out = new Float64Array(2);
    for (const proj of kinds) {
      const p = createProjector(parseFrameRequest({ camera, projection: proj, width: 300, height: 300 }).projection, 300, 300);
      for (const [x, y] of [[10.5, 20.5], [150, 150.25], [290.5, 77.5]]) {
        if (p.pixelToView(v, x, y) < 0) continue;
        expect(p.viewToPixel(out, v[0], v[1], v[2])).toBe(true);
        expect(close(out[0], x, 1e-7) && close(out[1], y, 1e-7)).toBe(true);
      }
    }
  });

  it('should reject non-square dome frames with a RangeError naming height', () => {
    expect(() => createProjector({ kind: 'dome', apertureDeg: 180, tiltDeg: 0 }, 100, 90)).toThrow(/height/);
  });
});
