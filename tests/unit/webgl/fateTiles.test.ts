import { describe, expect, it } from 'vitest';
import { parseFrameRequest } from '@/lib/render/schema';
import { prepareFrame } from '@/lib/render/frame';
import { createProjector } from '@/lib/render/projections';
import { prepareGpuFrame } from '@/lib/webgl/gpuFrame';
import { classifyFateTiles, GEOMETRY_STEP_PX, geometryGridSize, interiorSkyTiles, tileTriangles, TILE_MIXED, TILE_NONE, TILE_SKY, TILE_SKY_INTERIOR, TILE_SURFACE } from '@/lib/webgl/fateTiles';
import { createSourceTracer, SOURCE_RECORD_LENGTH, traceSourceDirection } from '@/lib/webgl/sourceDirections';
import { renderSourceDirections } from '@/lib/webgl/sourceDirections';

// Circular geodesic at r = 6M: energy (1 - 2/r) / sqrt(1 - 3/r), angular momentum sqrt(r) / sqrt(1 - 3/r)
// (Hartle 2003, Gravity, eqs. 9.30-9.31, with M = 1).
const ORBIT_6M = { kind: 'fourVelocity', radiusM: 6, energy: (2 / 3) / Math.sqrt(0.5), angularMomentum: Math.sqrt(6) / Math.sqrt(0.5) };

const CASES = [
  { name: 'hovering at 3.5 M looking at the hole, flat', state: { kind: 'hover', radiusM: 3.5 }, look: [-1, 0.9, 0.1], projection: { kind: 'flat', fovDeg: 90 }, width: 288, height: 192 },
  { name: 'falling at 1.2 M (inside the horizon), flat', state: { kind: 'radial', radiusM: 1.2, energy: 1 }, look: [-0.3, 1, 0.2], projection: { kind: 'flat', fovDeg: 100 }, width: 288, height: 192 },
  { name: 'falling at 0.5 M, dome master tilted', state: { kind: 'radial', radiusM: 0.5, energy: 1 }, look: [1, 0.3, 0], projection: { kind: 'dome', apertureDeg: 180 }, width: 240, height: 240 },
  { name: 'hovering at 3.5 M, dome master', state: { kind: 'hover', radiusM: 3.5 }, look: [-1, 0.4, 0], projection: { kind: 'dome', apertureDeg: 200 }, width: 240, height: 240 },
  { name: 'circular orbit at 6 M (aberration), flat', state: ORBIT_6M, look: [-1, -0.5, 0.2], projection: { kind: 'flat', fovDeg: 70 }, width: 288, height: 192 },
  { name: 'hovering at 3 M, cube face (left)', state: { kind: 'hover', radiusM: 3 }, look: [-1, 0.6, 0.2], projection: { kind: 'cubeFace', face: 'left' }, width: 192, height: 192 },
  { name: 'plunging with angular momentum at 2.5 M, equirectangular', state: { kind: 'fourVelocity', radiusM: 2.5, energy: 1, angularMomentum: 3.9 }, look: [-1, 0, 0], projection: { kind: 'equirect' }, width: 288, height: 144 },
];

function request(c: (typeof CASES)[number]) {
  return parseFrameRequest({ camera: { state: c.state, look: c.look, up: [0, 0, 1] }, projection: c.projection, width: c.width, height: c.height, sky: { stars: { enabled: false }, milkyWay: { enabled: false } } });
}

describe('classifyFateTiles', () => {
  for (const c of CASES) {
    for (const tilePx of [16]) {
      it(`should give every pixel the program its ray needs: ${c.name}, ${tilePx} px tiles`, () => {
        const req = request(c);
        const frame = prepareGpuFrame(req);
        const tiles = classifyFateTiles({ ...frame, table: frame.table! }, createProjector(req.projection, req.width, req.height), tilePx);
        // reference: lib/render's own per-pixel trace (fate 0 sky, 1 horizon, 2 far side, -1 outside the image)
        const directions = renderSourceDirections(prepareFrame(req, {}));
        const counts = [0, 0, 0, 0];
        for (let y = 0; y < req.height; y++) {
          for (let x = 0; x < req.width; x++) {
            const tileClass = tiles.classes[Math.floor(y / tilePx) * tiles.tilesX + Math.floor(x / tilePx)];
            const fate = directions[5 * (y * req.width + x) + 3];
            counts[tileClass]++;
            if (tileClass === TILE_NONE) expect(fate, `pixel ${x},${y}`).toBe(-1);
            if (tileClass === TILE_SKY) expect(fate, `pixel ${x},${y}`).toBe(0);
            if (tileClass === TILE_SURFACE) expect([1, 2], `pixel ${x},${y}`).toContain(fate);
          }
        }
        // the split pays: most pixels get a program without the other side's work
        expect(counts[TILE_MIXED]).toBeLessThan(0.5 * req.width * req.height);
        expect(counts[TILE_SKY] + counts[TILE_SURFACE]).toBeGreaterThan(0);
      });
    }
  }

  it('should mark a frame without the hole in view as all sky', () => {
    const req = parseFrameRequest({ camera: { state: { kind: 'hover', radiusM: 20 }, look: [1, 0, 0], up: [0, 0, 1] }, projection: { kind: 'flat', fovDeg: 60 }, width: 64, height: 32 });
    const frame = prepareGpuFrame(req);
    const tiles = classifyFateTiles({ ...frame, table: frame.table! }, createProjector(req.projection, 64, 32));
    expect(Array.from(tiles.classes).every((k) => k === TILE_SKY)).toBe(true);
  });

  it('should reject a tile size below one pixel', () => {
    const req = request(CASES[0]);
    const frame = prepareGpuFrame(req);
    expect(() => classifyFateTiles({ ...frame, table: frame.table! }, createProjector(req.projection, req.width, req.height), 0)).toThrow(/tilePx/);
  });
});

describe('tileTriangles', () => {
  it('should cover each tile of a class once, edge frames clipped to the frame (areas in clip space)', () => {
    // 40 x 24 px in 16 px tiles: columns 16, 16, 8 px wide; rows 16, 8 px high
    const tiles = { tilesX: 3, tilesY: 2, classes: Uint8Array.from([TILE_SKY, TILE_SURFACE, TILE_SKY, TILE_MIXED, TILE_SKY, TILE_NONE]) };
    const out = new Float32Array(18 * 6);
    const area = (n: number) => {
      let sum = 0;
      for (let k = 0; k < n; k += 3) {
        const [ax, ay, bx, by, cx, cy] = [out[3 * k], out[3 * k + 1], out[3 * k + 3], out[3 * k + 4], out[3 * k + 6], out[3 * k + 7]];
        sum += Math.abs((bx - ax) * (cy - ay) - (cx - ax) * (by - ay)) / 2;
      }
      return sum;
    };
    const pxArea = (2 / 40) * (2 / 24);
    expect(tileTriangles(tiles, TILE_SKY, 40, 24, out, 16)).toBe(18);
    expect(area(18)).toBeCloseTo((16 * 16 + 8 * 16 + 16 * 8) * pxArea, 6);
    expect(tileTriangles(tiles, TILE_NONE, 40, 24, out, 16)).toBe(6);
    expect(tileTriangles(tiles, TILE_MIXED, 40, 24, out, 16)).toBe(6);
    expect(area(6)).toBeCloseTo(16 * 8 * pxArea, 6);
    // the mixed tile is the bottom-left one: x from -1 to -1 + 32/40, y from 1 - 32/24 to -1
    expect(Math.min(out[0], out[3], out[6])).toBeCloseTo(-1, 6);
    expect(Math.min(out[1], out[4], out[7])).toBeCloseTo(-1, 6);
    expect(Math.max(out[1], out[4], out[7])).toBeCloseTo(1 - 32 / 24, 6);
  });

  it('should merge tiles of a class into rectangles that cover each of its pixels exactly once', () => {
    // 5 x 3 tiles of 4 px (20 x 12 px): a 3 x 2 block of sky with one surface tile in it, and sky elsewhere
    const S = TILE_SKY;
    const F = TILE_SURFACE;
    const tiles = { tilesX: 5, tilesY: 3, classes: Uint8Array.from([S, S, S, F, S, S, F, S, F, S, S, S, S, S, S]) };
    const out = new Float32Array(18 * 15);
    const vertices = tileTriangles(tiles, TILE_SKY, 20, 12, out, 4);
    // fewer triangles than two per tile (11 sky tiles)
    expect(vertices).toBeLessThan(6 * 11);
    // every pixel's sample point lies in exactly one triangle if its tile is sky, in none otherwise (edge
    // function test; the points sit off the pixel centres so that none lies on a rectangle's diagonal)
    const inside = (k: number, x: number, y: number) => {
      const p = [0, 1, 2].map((v) => [out[3 * (k + v)], out[3 * (k + v) + 1]]);
      const side = (a: number[], b: number[]) => (b[0] - a[0]) * (y - a[1]) - (b[1] - a[1]) * (x - a[0]);
      const s = [side(p[0], p[1]), side(p[1], p[2]), side(p[2], p[0])];
      return s.every((v) => v > 0) || s.every((v) => v < 0);
    };
    for (let py = 0; py < 12; py++) {
      for (let px = 0; px < 20; px++) {
        const x = ((px + 0.37) / 20) * 2 - 1;
        const y = 1 - ((py + 0.61) / 12) * 2;
        let hits = 0;
        for (let k = 0; k < vertices; k += 3) if (inside(k, x, y)) hits++;
        expect(hits).toBe(tiles.classes[Math.floor(py / 4) * 5 + Math.floor(px / 4)] === TILE_SKY ? 1 : 0);
      }
    }
  });
});

describe('interiorSkyTiles', () => {
  it('should mark the sky tiles whose eight neighbours are sky, never on the frame border', () => {
    const S = TILE_SKY;
    // 5 x 4 tiles, a surface tile at (3, 1)
    const tiles = { tilesX: 5, tilesY: 4, classes: Uint8Array.from([S, S, S, S, S, S, S, S, TILE_SURFACE, S, S, S, S, S, S, S, S, S, S, S]) };
    const out = interiorSkyTiles(tiles);
    // interior candidates (1..3, 1..2): (1, 1) and (1, 2) have all-sky neighbours; (2, *) touch the surface tile
    const interior = Array.from(out.classes, (k, i) => (k === TILE_SKY_INTERIOR ? i : -1)).filter((i) => i >= 0);
    expect(interior).toEqual([6, 11]);
    // the input is left as it was
    expect(Array.from(tiles.classes).includes(TILE_SKY_INTERIOR)).toBe(false);
  });

  // The claim behind interpolated geometry: where a tile is interior, the bilinear interpolation of the traced
  // directions and footprints of the grid points GEOMETRY_STEP_PX apart (what shaders/sky.geometry.frag writes and
  // sky.lensed.frag reads) stays within a small part of a pixel's footprint of each pixel's own trace (the
  // reference: lib/render's trace, lib/webgl/sourceDirections.ts).
  // the cases with sky away from the shadow (the others' frames are mostly shadow and ring at these sizes)
  for (const c of CASES.filter((k) => /1\.2 M|0\.5 M|orbit/.test(k.name))) {
    it(`should keep interpolated directions within 0.1 footprint of the traced ones in interior tiles: ${c.name}`, () => {
      const req = request(c);
      const frame = prepareGpuFrame(req);
      const tiles = interiorSkyTiles(classifyFateTiles({ ...frame, table: frame.table! }, createProjector(req.projection, req.width, req.height)));
      const tracer = createSourceTracer(prepareFrame(req, {}));
      const step = GEOMETRY_STEP_PX;
      const { across, down } = geometryGridSize(req.width, req.height);
      const grid = new Float64Array(across * down * 4);
      const rec = new Float64Array(SOURCE_RECORD_LENGTH);
      for (let j = 0; j < down; j++) {
        for (let i = 0; i < across; i++) {
          traceSourceDirection(tracer, i * step + 0.5, j * step + 0.5, rec);
          grid.set([rec[0], rec[1], rec[2], rec[10]], 4 * (j * across + i));
        }
      }
      let worst = 0;
      let worstFoot = 0;
      let checked = 0;
      for (let y = 0; y < req.height; y++) {
        for (let x = 0; x < req.width; x++) {
          if (tiles.classes[Math.floor(y / 16) * tiles.tilesX + Math.floor(x / 16)] !== TILE_SKY_INTERIOR) continue;
          const gx = x / step;
          const gy = y / step;
          const i = Math.floor(gx);
          const j = Math.floor(gy);
          const fx = gx - i;
          const fy = gy - j;
          const v = [0, 0, 0, 0];
          for (const [di, dj, w] of [[0, 0, (1 - fx) * (1 - fy)], [1, 0, fx * (1 - fy)], [0, 1, (1 - fx) * fy], [1, 1, fx * fy]]) {
            for (let k = 0; k < 4; k++) v[k] += w * grid[4 * ((j + dj) * across + i + di) + k];
          }
          traceSourceDirection(tracer, x + 0.5, y + 0.5, rec);
          expect(rec[9], `pixel ${x},${y} reaches the sky`).toBe(0);
          const len = Math.hypot(v[0], v[1], v[2]);
          const angle = Math.hypot(v[0] / len - rec[0], v[1] / len - rec[1], v[2] / len - rec[2]);
          worst = Math.max(worst, angle / rec[10]);
          worstFoot = Math.max(worstFoot, Math.abs(v[3] / rec[10] - 1));
          checked++;
        }
      }
      expect(checked).toBeGreaterThan(0);
      expect(worst).toBeLessThan(0.1);
      expect(worstFoot).toBeLessThan(0.05);
    });
  }
});
