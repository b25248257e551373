/** Messages between the scene preview and its CPU render worker. */
import type { FrameRequest } from '@/lib/render/schema';

/** Page -> worker: render one frame (sky assets fetched once from assetBase). */
export interface PreviewRenderMessage {
  id: number;
  request: FrameRequest;
  /** absolute URL prefix of the sky-assets API */
  assetBase: string;
}

/** Worker -> page: sRGB RGBA bytes, rows from the top, or an error. */
export type PreviewRenderReply =
  | { id: number; ok: true; width: number; height: number; rgba: Uint8ClampedArray; renderMs: number; skyMissing: boolean }
  | { id: number; ok: false; error: string };
