import { describe, expect, it } from 'vitest';
import { pixelToViewMirror, projectionConstants } from '@/lib/webgl/projectionConstants';
import { createProjector } from '@/lib/render/projections';
import { expectClose } from './close';

const angleFromCentre = (v: Float64Array) => Math.acos(Math.max(-1, Math.min(1, v[2])));

describe('pixelToViewMirror', () => {
  it('should map the dome master azimuthal-equidistantly (physics.md section 7, fulldome trade convention)', () => {
    const k = projectionConstants({ kind: 'dome', apertureDeg: 200, tiltDeg: 0 }, 400, 400);
    const v = new Float64Array(3);
    for (const rho of [0, 50, 100, 150, 199]) {
      pixelToViewMirror(v, k, 200 + rho, 200);
      // angle from the zenith proportional to distance from the centre; the frame width spans the aperture
      expectClose(angleFromCentre(v), (rho / 200) * ((200 * Math.PI) / 180 / 2), 1e-12, `rho ${rho}`);
    }
    expect(pixelToViewMirror(v, k, 0, 0)).toBe(-1);
  });

  it('should span the horizontal field of view of a flat frame edge to edge (physics.md section 7)', () => {
    const k = projectionConstants({ kind: 'flat', fovDeg: 70 }, 640, 360);
    const v = new Float64Array(3);
    pixelToViewMirror(v, k, 0, 180);
    expectClose(angleFromCentre(v), (35 * Math.PI) / 180, 1e-12);
  });

  it('should agree with lib/render createProjector for all four projections', () => {
    const projections = [
      { p: { kind: 'flat', fovDeg: 80 } as const, w: 64, h: 36 },
      { p: { kind: 'dome', apertureDeg: 220, tiltDeg: 10 } as const, w: 48, h: 48 },
      { p: { kind: 'equirect' } as const, w: 64, h: 32 },
      ...(['front', 'back', 'left', 'right', 'up', 'down'] as const).map((face) => ({ p: { kind: 'cubeFace', face } as const, w: 32, h: 32 })),
    ];
    const a = new Float64Array(3);
    const b = new Float64Array(3);
    for (const { p, w, h } of projections) {
      const k = projectionConstants(p, w, h);
      const ref = createProjector(p, w, h);
      for (let y = 0.5; y < h; y += 3) {
        for (let x = 0.5; x < w; x += 3) {
          const sa = pixelToViewMirror(a, k, x, y);
          const sb = ref.pixelToView(b, x, y);
          expectClose(sa, sb, 1e-12, `${JSON.stringify(p)} size`);
          if (sb >= 0) for (let i = 0; i < 3; i++) expectClose(a[i], b[i], 1e-12, `${JSON.stringify(p)} ${x},${y}`);
        }
      }
    }
  });

  it('should reject non-square dome frames', () => {
    expect(() => projectionConstants({ kind: 'dome', apertureDeg: 180, tiltDeg: 0 }, 64, 32)).toThrow(RangeError);
  });
});
