/** Messages between the page and the CPU render worker. */
import type { FrameRequest } from '@/lib/render/schema';
import type { SkyViewMode } from '../gpu/gpu-sky-renderer';

/** Page -> worker: render one frame. */
export interface CpuRenderMessage {
  id: number;
  request: FrameRequest;
  mode: SkyViewMode;
  /** absolute URL prefix of the sky-assets API */
  assetBase: string;
}

/** Worker -> page: the frame (sRGB RGBA bytes, rows from the top) or an error. */
export type CpuRenderReply =
  | { id: number; ok: true; width: number; height: number; rgba: Uint8ClampedArray; renderMs: number }
  | { id: number; ok: false; error: string };
