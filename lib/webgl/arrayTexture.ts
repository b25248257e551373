/**
 * How the WebGL view lays a 1-D array (ray-table nodes, star entries) into a texture: rows of
 * ARRAY_TEXTURE_WIDTH texels, element i at column i mod width, row i div width. The shaders read them with
 * arrayTexel (shaders/sky.common.glsl), whose shift and mask assume this width.
 */

/** Texels per row: 2^10, shaders/sky.common.glsl ARRAY_TEXTURE_WIDTH_LOG2. */
export const ARRAY_TEXTURE_WIDTH = 1024;

/** Rows needed for `count` elements (at least one, so an empty array still makes a texture). */
export function arrayTextureRows(count: number): number {
  return Math.max(1, Math.ceil(count / ARRAY_TEXTURE_WIDTH));
}
