/** Shared helpers of the photosensitivity tests: tolerance comparison and synthetic frames. */
import { createProjector } from '@/lib/render/projections';
import type { Projection } from '@/lib/render/schema';

/** |a - b| <= tol. */
export function close(a: number, b: number, tol: number): boolean {
  return Math.abs(a - b) <= tol;
}

/** |a - b| <= rel |b|. */
export function closeRel(a: number, b: number, rel: number): boolean {
  return Math.abs(a - b) <= rel * Math.abs(b);
}

export const DOME_180: Projection = { kind: 'dome', apertureDeg: 180, tiltDeg: 0 };

/** A frame of one colour: 8-bit codes (Uint8Array) or floats (Float32Array), RGB. */
export function uniformFrame(width: number, height: number, rgb: readonly number[], kind: 'u8' | 'f32' = 'u8'): Uint8Array | Float32Array {
  const n = width * height;
  const out = kind === 'u8' ? new Uint8Array(3 * n) : new Float32Array(3 * n);
  for (let i = 0; i < n; i++) {
    out[3 * i] = rgb[0];
    out[3 * i + 1] = rgb[1];
    out[3 * i + 2] = rgb[2];
  }
  return out;
}

/**
 * An 8-bit frame of `background` with `patch` painted where the pixel's view direction
 * lies within radiusDeg of `centre` (a circular cap on the sky, measured from the projection centre).
 */
export function capFrame(
  projection: Projection,
  size: number,
  centre: readonly number[],
  radiusDeg: number,
  patch: readonly number[],
  background: readonly number[],
): Uint8Array {
  const p = createProjector(projection, size, size);
  const v = new Float64Array(3);
  const cosR = Math.cos((radiusDeg * Math.PI) / 180);
  const out = uniformFrame(size, size, background) as Uint8Array;
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      if (p.pixelToView(v, x + 0.5, y + 0.5) < 0) continue;
      if (v[0] * centre[0] + v[1] * centre[1] + v[2] * centre[2] < cosR) continue;
      const o = 3 * (y * size + x);
      out[o] = patch[0];
      out[o + 1] = patch[1];
      out[o + 2] = patch[2];
    }
  }
  return out;
}

/** An 8-bit frame of `background` with a disc of radiusPx frame pixels around (cx, cy) painted `patch`. */
export function pixelDiscFrame(size: number, cx: number, cy: number, radiusPx: number, patch: readonly number[], background: readonly number[]): Uint8Array {
  const out = uniformFrame(size, size, background) as Uint8Array;
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      if ((x + 0.5 - cx) ** 2 + (y + 0.5 - cy) ** 2 > radiusPx * radiusPx) continue;
      const o = 3 * (y * size + x);
      out[o] = patch[0];
      out[o + 1] = patch[1];
      out[o + 2] = patch[2];
    }
  }
  return out;
}

/** Frames that show `a` or `b`: frame i shows b when stateOf(i) is true. */
export function sequence<T>(count: number, a: T, b: T, stateOf: (i: number) => boolean): T[] {
  return Array.from({ length: count }, (_, i) => (stateOf(i) ? b : a));
}
