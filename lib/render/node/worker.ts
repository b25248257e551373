/**
 * Worker-thread entry of the render pool (Node only, loaded by piscina). Each
 * task renders one band of rows with the frame's shared lensing table and
 * shared sky assets; the frame plan (star field, sky maps) is built once per
 * frame per worker. Imports only the pure core, so workers start fast.
 */
import { move } from 'piscina';
import { prepareFrame, type FramePlan, type SkyAssets } from '../frame';
import type { RayTableArrays } from '../engine';
import { renderBandEncoded } from '../renderRows';
import type { FrameRequest } from '../schema';

/** One task: a band of rows of one frame. */
export interface BandTask {
  frameKey: string;
  /** validated request (defaults filled) */
  request: FrameRequest;
  lens: RayTableArrays | null;
  /** sky assets in shared memory, and a key naming them (same key = same content) */
  assets: SkyAssets;
  assetKey: string;
  y0: number;
  y1: number;
  bitDepth: 8 | 16;
}

let cachedPlan: { key: string; plan: FramePlan } | null = null;
let cachedAssets: { key: string; assets: SkyAssets } | null = null;

/**
 * Render one band in this thread (also used when the pool has no workers).
 * @param task band task
 * @returns encoded samples of the band (3 per pixel)
 */
export function renderBand(task: BandTask): Uint8Array | Uint16Array {
  if (!cachedPlan || cachedPlan.key !== task.frameKey) {
    // keep one assets object per key so the plan's per-asset caches (mip pyramids) survive across frames
    if (!cachedAssets || cachedAssets.key !== task.assetKey) cachedAssets = { key: task.assetKey, assets: task.assets };
    cachedPlan = { key: task.frameKey, plan: prepareFrame(task.request, cachedAssets.assets, task.lens) };
  }
  return renderBandEncoded(cachedPlan.plan, { y0: task.y0, y1: task.y1 }, task.bitDepth);
}

/**
 * Piscina entry: render one band.
 * @param task band task
 * @returns encoded samples of the band (3 per pixel), moved to the caller's thread
 */
export default function renderBandTask(task: BandTask): Uint8Array | Uint16Array {
  return move(renderBand(task)) as Uint8Array | Uint16Array;
}
