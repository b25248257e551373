/**
 * A small handle on window for tests and the benchmark: which path draws the
 * view, the request it drew, and read-backs of the picture and (WebGL only) the
 * "where the light comes from" directions. Binary data travels as base64.
 */
import type { FrameRequest } from '@/lib/render/schema';

/** What a mounted SkyView exposes as window.__skywellSkyView. */
export interface SkyViewDebugHandle {
  path: 'webgl' | 'cpu';
  request: FrameRequest | null;
  /** RGBA8 bytes of the last frame, rows from the top, base64 */
  readFrame(): Promise<string>;
  /** WebGL only: 4 float32 per pixel (hole-frame direction, fate), rows from the top, base64 */
  readDirections?(): Promise<string>;
}

declare global {
  interface Window {
    __skywellSkyView?: SkyViewDebugHandle;
    /** frames put on screen by any sky view since the page loaded (read by the editor preview bench) */
    __skywellFramesShown?: number;
  }
}

/** Count one frame put on screen (WebGL draw or CPU frame painted). */
export function countFrameShown(): void {
  window.__skywellFramesShown = (window.__skywellFramesShown ?? 0) + 1;
}

/** Base64 of a typed array's bytes. */
export function toBase64(data: Uint8Array | Uint8ClampedArray | Float32Array): string {
  const bytes = new Uint8Array(data.buffer, data.byteOffset, data.byteLength);
  let text = '';
  for (let i = 0; i < bytes.length; i += 0x8000) text += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
  return btoa(text);
}

/** Install the handle (replacing another view's). */
export function publishDebugHandle(handle: SkyViewDebugHandle): () => void {
  window.__skywellSkyView = handle;
  return () => {
    if (window.__skywellSkyView === handle) delete window.__skywellSkyView;
  };
}
