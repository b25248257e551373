import { describe, expect, it } from 'vitest';
import { buildStarField, STAR_CELL_SIZE } from '@/lib/render/starField';
import { allocateCatalogue, type StarCatalogue } from '@/lib/render/starCatalogue';
import { engineTemperatureFromBv } from '@/lib/render/engine';
import { buildStarTileIndex, decodeStarEntry, STAR_TILE_CUBE_EDGE, STAR_TILE_LEVELS, starTileOf, unpackTile, type StarEntry, type StarTile } from '@/lib/webgl/starTiles';
import { SKY_LENSED_FRAG } from '@/lib/webgl/shaderSources';
import { expectClose } from './close';

/** A small deterministic catalogue scattered over the sphere (uniform in sin(dec)), with a dense patch. */
function syntheticCatalogue(count: number): StarCatalogue {
  let seed = 12345;
  const random = () => {
    // Park & Miller 1988 minimal standard generator
    seed = (seed * 16807) % 2147483647;
    return seed / 2147483647;
  };
  const cat: StarCatalogue = allocateCatalogue(count);
  for (let i = 0; i < count; i++) {
    const dense = i % 5 === 0;
    cat.raDeg[i] = dense ? 40 + 2 * random() : 360 * random();
    cat.decDeg[i] = dense ? 44 + 2 * random() : (Math.asin(2 * random() - 1) * 180) / Math.PI;
    cat.mag[i] = -1 + 9 * random();
    cat.bv[i] = -0.3 + 2 * random();
  }
  return cat;
}

const field = buildStarField(syntheticCatalogue(4000), 8.5, engineTemperatureFromBv);
const index = buildStarTileIndex(field);

/** Channel k of the tile cube's texel (face, column, row): the packed list of level k there. */
function packedAt(face: number, column: number, row: number, k: number): number {
  return index.tiles[face].data[4 * (row * STAR_TILE_CUBE_EDGE + column) + k];
}

/** The list of level k that the shader reads for direction d: channel k of the cube texel holding d. */
function listOf(k: number, d: readonly number[]): { first: number; count: number } {
  const t = starTileOf(d[0], d[1], d[2], STAR_TILE_CUBE_EDGE, { face: 0, column: 0, row: 0 });
  return unpackTile(packedAt(t.face, t.column, t.row, k), index.countBits);
}

const entry = (): StarEntry => ({ x: 0, y: 0, z: 0, flux: 0, logTemperature: 0 });

describe('starTileOf', () => {
  it('should put each axis direction at the centre of its own cube face (common practice: cube-map faces by the largest component)', () => {
    const out: StarTile = { face: -1, column: -1, row: -1 };
    const axes = [[1, 0, 0], [-1, 0, 0], [0, 1, 0], [0, -1, 0], [0, 0, 1], [0, 0, -1]];
    axes.forEach((a, face) => {
      starTileOf(a[0], a[1], a[2], 256, out);
      expect(out.face).toBe(face);
      expect(out.column).toBe(128);
      expect(out.row).toBe(128);
    });
  });

  it('should pick the face and texel of a cube-map lookup (OpenGL ES 3.0.6 section 3.8.10, Table 3.21: major axis, sc, tc)', () => {
    // one direction off the centre of each face, (s, t) = ((sc / |ma| + 1) / 2, (tc / |ma| + 1) / 2) from the table
    const cases: { d: number[]; face: number; s: number; t: number }[] = [
      { d: [1, -0.5, 0.25], face: 0, s: (-0.25 + 1) / 2, t: (0.5 + 1) / 2 }, // +x: sc = -rz, tc = -ry
      { d: [-1, -0.5, 0.25], face: 1, s: (0.25 + 1) / 2, t: (0.5 + 1) / 2 }, // -x: sc = +rz, tc = -ry
      { d: [0.25, 1, -0.5], face: 2, s: (0.25 + 1) / 2, t: (-0.5 + 1) / 2 }, // +y: sc = +rx, tc = +rz
      { d: [0.25, -1, -0.5], face: 3, s: (0.25 + 1) / 2, t: (0.5 + 1) / 2 }, // -y: sc = +rx, tc = -rz
      { d: [0.25, -0.5, 1], face: 4, s: (0.25 + 1) / 2, t: (0.5 + 1) / 2 }, // +z: sc = +rx, tc = -ry
      { d: [0.25, -0.5, -1], face: 5, s: (-0.25 + 1) / 2, t: (0.5 + 1) / 2 }, // -z: sc = -rx, tc = -ry
    ];
    const out: StarTile = { face: -1, column: -1, row: -1 };
    for (const c of cases) {
      // any length: only the direction matters
      starTileOf(3 * c.d[0], 3 * c.d[1], 3 * c.d[2], 64, out);
      expect(out).toEqual({ face: c.face, column: Math.floor(c.s * 64), row: Math.floor(c.t * 64) });
    }
  });

  it('should reject a zero vector and a bad tile count', () => {
    const out: StarTile = { face: 0, column: 0, row: 0 };
    expect(() => starTileOf(0, 0, 0, 256, out)).toThrow(RangeError);
    expect(() => starTileOf(1, 0, 0, 0, out)).toThrow(RangeError);
  });
});

describe('buildStarTileIndex', () => {
  it('should list, for any direction, every star that lib/render star loop sums at any reach up to the level margin', () => {
    // lib/render/shade.ts sums every star with |star - d| < 3 sigma; brute force over all stars is the reference
    const stars = field.count;
    let checked = 0;
    let random = 7;
    const next = () => {
      random = (random * 16807) % 2147483647;
      return random / 2147483647;
    };
    for (let trial = 0; trial < 3000; trial++) {
      // half the trials right next to a star (where kernels are summed), half anywhere
      let d: number[];
      if (trial % 2 === 0) {
        const s = Math.floor(next() * stars);
        d = [field.x[s] + 0.01 * (next() - 0.5), field.y[s] + 0.01 * (next() - 0.5), field.z[s] + 0.01 * (next() - 0.5)];
      } else {
        d = [next() - 0.5, next() - 0.5, next() - 0.5];
      }
      const len = Math.hypot(d[0], d[1], d[2]);
      d = d.map((c) => c / len);
      STAR_TILE_LEVELS.forEach((level, k) => {
        const { first, count } = listOf(k, d);
        const listed = Array.from({ length: count }, (_, j) => decodeStarEntry(index, first + j, entry()));
        for (let s = 0; s < stars; s++) {
          const dist = Math.hypot(field.x[s] - d[0], field.y[s] - d[1], field.z[s] - d[2]);
          if (dist >= level.marginChord) continue;
          checked++;
          // float32 storage of direction x flux: the decoded direction is within ~1e-7 of the star's
          const found = listed.some((e) => Math.hypot(e.x - field.x[s], e.y - field.y[s], e.z - field.z[s]) < 1e-6);
          expect(found, `level ${k}, star ${s} at chord ${dist}`).toBe(true);
        }
      });
    }
    expect(checked).toBeGreaterThan(1000);
  });

  it('should end with a level whose margin is the widest reach summed star by star (3 sigma_max = STAR_CELL_SIZE, lib/render/shade.ts)', () => {
    expectClose(STAR_TILE_LEVELS[STAR_TILE_LEVELS.length - 1].marginChord, STAR_CELL_SIZE, 1e-15);
    for (let k = 1; k < STAR_TILE_LEVELS.length; k++) expect(STAR_TILE_LEVELS[k].marginChord).toBeGreaterThan(STAR_TILE_LEVELS[k - 1].marginChord);
  });

  it('should have as many levels as the shader reads, one per channel of the tile cube (shaders/sky.lensed.frag; common practice: one source of truth checked)', () => {
    expect(SKY_LENSED_FRAG).toContain('uniform vec4 uStarTileMargins;');
    expect(SKY_LENSED_FRAG).toContain('reach <= m.x ? lists.x : reach <= m.y ? lists.y : reach <= m.z ? lists.z : lists.w');
    expect(STAR_TILE_LEVELS.length).toBe(4);
    for (const level of STAR_TILE_LEVELS) expect(STAR_TILE_CUBE_EDGE % level.tilesPerEdge).toBe(0);
    expect(index.tiles.map((face) => [face.width, face.height, face.channels, face.data.length])).toEqual(
      Array.from({ length: 6 }, () => [STAR_TILE_CUBE_EDGE, STAR_TILE_CUBE_EDGE, 4, 4 * STAR_TILE_CUBE_EDGE * STAR_TILE_CUBE_EDGE]),
    );
  });

  it('should carry each listed star direction, flux and log temperature from lib/render buildStarField', () => {
    const e1 = entry();
    let checked = 0;
    for (let e = 0; e < index.entryCount; e += 97) {
      decodeStarEntry(index, e, e1);
      // the star whose direction it carries (brute force)
      let best = -1;
      let bestDist = Infinity;
      for (let s = 0; s < field.count; s++) {
        const dist = Math.hypot(e1.x - field.x[s], e1.y - field.y[s], e1.z - field.z[s]);
        if (dist < bestDist) {
          bestDist = dist;
          best = s;
        }
      }
      // float32 storage: relative rounding 6e-8 per component
      expect(bestDist).toBeLessThan(1e-6);
      expectClose(e1.flux, field.flux[best], 3e-7 * field.flux[best]);
      expectClose(e1.logTemperature, field.logTemperature[best], 1e-6);
      checked++;
    }
    expect(checked).toBeGreaterThan(100);
    expect(index.maxListLength).toBeGreaterThan(0);
  });

  it('should pack each tile as first entry and count, the same in every texel it covers, the lists covering the entries without gaps', () => {
    let covered = 0;
    let expectedFirst = 0;
    const misplaced: string[] = [];
    for (let k = 0; k < STAR_TILE_LEVELS.length; k++) {
      const n = STAR_TILE_LEVELS[k].tilesPerEdge;
      const texels = STAR_TILE_CUBE_EDGE / n;
      for (let face = 0; face < 6; face++) {
        for (let row = 0; row < n; row++) {
          for (let column = 0; column < n; column++) {
            const packed = packedAt(face, column * texels, row * texels, k);
            // the far corner texel of the tile carries the same list
            if (packedAt(face, (column + 1) * texels - 1, (row + 1) * texels - 1, k) !== packed) misplaced.push(`level ${k} face ${face} tile ${column},${row}: texels differ`);
            const { first, count } = unpackTile(packed, index.countBits);
            // lists are appended level after level, face after face, row after row
            if (count > 0 && first !== expectedFirst) misplaced.push(`level ${k} face ${face} tile ${column},${row}: first ${first}, expected ${expectedFirst}`);
            if (count > index.maxListLength) misplaced.push(`level ${k} face ${face} tile ${column},${row}: count ${count} over the longest list`);
            expectedFirst = first + count;
            covered += count;
          }
        }
      }
    }
    expect(misplaced.slice(0, 5)).toEqual([]);
    expect(covered).toBe(index.entryCount);
    expect(2 ** index.countBits).toBeGreaterThan(index.maxListLength);
  });
});
