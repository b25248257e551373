import { describe, expect, it } from 'vitest';
import { parseFrameRequest } from '@/lib/render/schema';
import { engineCameraOptics } from '@/lib/render/engine';
import { prepareGpuFrame, TONE_MAP_CODES } from '@/lib/webgl/gpuFrame';
import { PROJECTION_CODES } from '@/lib/webgl/projectionConstants';
import { directionsShaderDefines, lensedShaderDefines, shaderVariantKey, tileShaderDefines } from '@/lib/webgl/shaderVariant';

/** A valid lib/render request: a camera hovering at 7 M unless the fields say otherwise. */
const request = (fields: Record<string, unknown>) =>
  parseFrameRequest({ camera: { state: { kind: 'hover', radiusM: 7 } }, projection: { kind: 'flat', fovDeg: 60 }, width: 8, height: 8, ...fields });
const sky = { sourcesMode: false, stars: true, diffuse: true, milkyWay: true, uniformBrightness: 0 };

describe('directionsShaderDefines', () => {
  it('should switch the boost on exactly when lib/render boosts the camera (engineCameraOptics)', () => {
    const states = [
      { kind: 'hover', radiusM: 7 },
      { kind: 'radial', radiusM: 7, energy: 1 },
      { kind: 'fourVelocity', radiusM: 8, energy: 0.97, angularMomentum: 3.5, direction: 'in', motionAngleDeg: 0 },
    ];
    for (const state of states) {
      const req = request({ camera: { state } });
      const defines = directionsShaderDefines(prepareGpuFrame(req));
      expect(defines.BOOST, state.kind).toBe(engineCameraOptics(req.camera.state).boost ? 1 : 0);
      expect(defines.LENSING).toBe(1);
    }
  });

  it('should name the projection by the code the shader mirrors of lib/render/projections.ts', () => {
    for (const projection of [{ kind: 'flat', fovDeg: 60 }, { kind: 'dome', apertureDeg: 180, tiltDeg: 0 }, { kind: 'equirect' }, { kind: 'cubeFace', face: 'up' }] as const) {
      const req = request({ projection });
      expect(directionsShaderDefines(prepareGpuFrame(req)).PROJECTION).toBe(PROJECTION_CODES[projection.kind]);
    }
  });
});

describe('lensedShaderDefines', () => {
  it('should compile in the request settings of lib/render (samples, tone map, grids, lensing off)', () => {
    const req = request({
      supersampling: 3,
      exposure: { toneMap: 'reinhard' },
      effects: { lensing: false, horizonGrid: { enabled: false }, farSideGrid: { enabled: true } },
    });
    const d = lensedShaderDefines(prepareGpuFrame(req), { ...sky, sourcesMode: true, uniformBrightness: 5 });
    // lensing off: no ray ends on the horizon, so no grid code is compiled in
    expect(d).toMatchObject({ SAMPLES: 3, TONE_MAP: TONE_MAP_CODES.reinhard, HORIZON_GRID: 0, FAR_SIDE_GRID: 0, CELESTIAL_GRID: 1, LENSING: 0, BOOST: 0, UNIFORM_SKY: 1 });
  });

  it('should compile the far-side grid in only inside the horizon, where light from the far exterior arrives (physics.md section 5)', () => {
    const outside = lensedShaderDefines(prepareGpuFrame(request({ camera: { state: { kind: 'hover', radiusM: 7 } } })), sky);
    expect(outside).toMatchObject({ HORIZON_GRID: 1, FAR_SIDE_GRID: 0, DASHED_GRIDS: 0 });
    const inside = lensedShaderDefines(prepareGpuFrame(request({ camera: { state: { kind: 'radial', radiusM: 1, energy: 1 } } })), sky);
    // the far-side grid is dashed by default (lib/render/schema.ts)
    expect(inside).toMatchObject({ FAR_SIDE_GRID: 1, DASHED_GRIDS: 1 });
  });

  it('should leave the Milky Way out when no diffuse map is bound', () => {
    const frame = prepareGpuFrame(request({}));
    expect(lensedShaderDefines(frame, { ...sky, diffuse: false }).MILKY_WAY).toBe(0);
    expect(lensedShaderDefines(frame, sky).MILKY_WAY).toBe(1);
  });

  it('should reject supersampling outside 1..4', () => {
    const frame = prepareGpuFrame(request({}));
    expect(() => lensedShaderDefines({ ...frame, supersampling: 5 }, sky)).toThrow(RangeError);
  });
});

describe('tileShaderDefines', () => {
  it('should interpolate the geometry only in the interior sky program, which keeps the sky sources and drops the surface grids', () => {
    const full = { PROJECTION: 0, LENSING: 1, BOOST: 0, SAMPLES: 1, HORIZON_GRID: 1, FAR_SIDE_GRID: 0, DASHED_GRIDS: 1, CELESTIAL_GRID: 0, STARS: 1, DIFFUSE: 1, MILKY_WAY: 1, UNIFORM_SKY: 0 };
    const programs = tileShaderDefines(full);
    expect(programs.interior).toEqual({ ...programs.sky, INTERPOLATED_GEOMETRY: 1 });
    expect(programs.interior).toMatchObject({ STARS: 1, DIFFUSE: 1, MILKY_WAY: 1, HORIZON_GRID: 0, DASHED_GRIDS: 0 });
    expect(programs.sky.INTERPOLATED_GEOMETRY).toBeUndefined();
    expect(programs.surface).toMatchObject({ STARS: 0, DIFFUSE: 0, HORIZON_GRID: 1 });
  });
});

describe('shaderVariantKey', () => {
  it('should not depend on the order the switches were listed in', () => {
    expect(shaderVariantKey({ B: 1, A: 2 })).toBe(shaderVariantKey({ A: 2, B: 1 }));
    expect(shaderVariantKey({ A: 1 })).not.toBe(shaderVariantKey({ A: 2 }));
  });
});
