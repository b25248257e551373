/**
 * three.js textures of the sky data built in lib/webgl (stars, cell index,
 * mip-mapped diffuse map, blackbody colour row) and of the per-frame ray table.
 */
import * as THREE from 'three';
import type { FloatImage, DiffuseTextures, ColourTexture, StarTextures } from '@/lib/webgl/skyTextures';
import type { PackedRayTable } from '@/lib/webgl/rayTableTexture';
import { ARRAY_TEXTURE_WIDTH } from '@/lib/webgl/arrayTexture';
import type { UintImage } from '@/lib/webgl/starTiles';

/** A nearest-filtered float texture holding a 1-D array laid out in rows. */
export function dataTexture(image: FloatImage): THREE.DataTexture {
  const format = image.channels === 1 ? THREE.RedFormat : image.channels === 2 ? THREE.RGFormat : THREE.RGBAFormat;
  const tex = new THREE.DataTexture(image.data, image.width, image.height, format, THREE.FloatType);
  tex.minFilter = THREE.NearestFilter;
  tex.magFilter = THREE.NearestFilter;
  tex.generateMipmaps = false;
  tex.needsUpdate = true;
  return tex;
}

/** An RGBA32UI cube map, nearest texel, no mip levels (faces +x, -x, +y, -y, +z, -z; four channels each). */
export function uintCubeTexture(faces: readonly UintImage[]): THREE.CubeTexture {
  const tex = new THREE.CubeTexture(
    faces.map((image) => {
      const face = new THREE.DataTexture(image.data, image.width, image.height, THREE.RGBAIntegerFormat, THREE.UnsignedIntType);
      face.internalFormat = 'RGBA32UI';
      return face;
    }),
  );
  tex.format = THREE.RGBAIntegerFormat;
  tex.type = THREE.UnsignedIntType;
  tex.internalFormat = 'RGBA32UI';
  tex.minFilter = THREE.NearestFilter;
  tex.magFilter = THREE.NearestFilter;
  tex.generateMipmaps = false;
  tex.flipY = false;
  tex.needsUpdate = true;
  return tex;
}

/** The diffuse sky map with lib/render's own mip pyramid (trilinear, wrapping in RA, clamped in Dec). */
export function diffuseTexture(diffuse: DiffuseTextures): THREE.DataTexture {
  const level0 = diffuse.levels[0];
  const tex = new THREE.DataTexture(level0.data, level0.width, level0.height, THREE.RGBAFormat, THREE.FloatType);
  tex.mipmaps = diffuse.levels.map((l) => ({ data: l.data, width: l.width, height: l.height })) as unknown as THREE.DataTexture['mipmaps'];
  tex.minFilter = THREE.LinearMipmapLinearFilter;
  tex.magFilter = THREE.LinearFilter;
  tex.wrapS = THREE.RepeatWrapping;
  tex.wrapT = THREE.ClampToEdgeWrapping;
  tex.generateMipmaps = false;
  tex.needsUpdate = true;
  return tex;
}

/** The blackbody colour row, linearly filtered. */
export function colourTexture(colour: ColourTexture): THREE.DataTexture {
  const tex = new THREE.DataTexture(colour.image.data, colour.image.width, 1, THREE.RGBAFormat, THREE.FloatType);
  tex.minFilter = THREE.LinearFilter;
  tex.magFilter = THREE.LinearFilter;
  tex.wrapS = THREE.ClampToEdgeWrapping;
  tex.generateMipmaps = false;
  tex.needsUpdate = true;
  return tex;
}

/** The ray-table node texture, reused across frames while it is large enough. */
export class RayTableTexture {
  texture: THREE.DataTexture;
  private rows: number;

  constructor(rows = 8) {
    this.rows = rows;
    this.texture = this.make(rows);
  }

  private make(rows: number): THREE.DataTexture {
    return dataTexture({ width: ARRAY_TEXTURE_WIDTH, height: rows, channels: 4, data: new Float32Array(ARRAY_TEXTURE_WIDTH * rows * 4) });
  }

  /** Copy a packed table's nodes in; returns true when the texture object changed (uniform must be reset). */
  update(table: PackedRayTable): boolean {
    let changed = false;
    if (table.textureHeight > this.rows) {
      this.texture.dispose();
      this.rows = table.textureHeight;
      this.texture = this.make(this.rows);
      changed = true;
    }
    (this.texture.image.data as Float32Array).set(table.nodes.subarray(0, table.textureHeight * ARRAY_TEXTURE_WIDTH * 4));
    this.texture.needsUpdate = true;
    return changed;
  }

  dispose(): void {
    this.texture.dispose();
  }
}

/** GPU copies of the star data: the tile lists of lib/webgl/starTiles.ts. */
export interface StarGpuTextures {
  /** per tile: first entry and count, packed; a cube map with one channel per tile level */
  tiles: THREE.CubeTexture;
  /** per entry: unit vector times flux, ln T */
  tileEntries: THREE.DataTexture;
}

/** Upload star textures. */
export function starTextures(stars: StarTextures): StarGpuTextures {
  return {
    tiles: uintCubeTexture(stars.tiles.tiles),
    tileEntries: dataTexture(stars.tiles.entries),
  };
}
