/// <reference lib="webworker" />
/**
 * The CPU fallback: lib/render's reference renderer in a Web Worker. Renders
 * whole frames with renderBandLinear, draws the celestial grid of the "where
 * the light comes from" mode with lib/webgl compositeCelestialGrid, encodes
 * sRGB bytes (lib/render srgbEncode8) and posts them back.
 */
import { parseFrameRequest } from '@/lib/render/schema';
import { prepareFrame, type SkyAssets } from '@/lib/render/frame';
import { renderBandLinear } from '@/lib/render/renderRows';
import { srgbEncode8 } from '@/lib/render/toneMap';
import { compositeCelestialGrid } from '@/lib/webgl/sourceDirections';
import { loadSkyAssets } from '../sky-assets';
import type { CpuRenderMessage, CpuRenderReply } from './cpu-protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;

async function render(message: CpuRenderMessage): Promise<CpuRenderReply> {
  const req = parseFrameRequest(message.request);
  const decoded = req.sky.stars.enabled || req.sky.milkyWay.enabled ? await loadSkyAssets(message.assetBase) : null;
  const assets: SkyAssets = {};
  if (decoded && req.sky.stars.enabled) assets.catalogue = decoded.catalogue;
  if (decoded && req.sky.milkyWay.enabled) assets.milkyWay = decoded.milkyWay;
  // panoramas are not served to browsers yet; render without one
  const plan = prepareFrame({ ...req, sky: { ...req.sky, panorama: undefined } }, assets);
  const t0 = performance.now();
  const band = { y0: 0, y1: req.height };
  const linear = renderBandLinear(plan, band);
  if (message.mode === 'sources') compositeCelestialGrid(plan, band, linear);
  const rgba = new Uint8ClampedArray(req.width * req.height * 4);
  for (let i = 0, j = 0; i < linear.length; i += 3, j += 4) {
    rgba[j] = srgbEncode8(linear[i]);
    rgba[j + 1] = srgbEncode8(linear[i + 1]);
    rgba[j + 2] = srgbEncode8(linear[i + 2]);
    rgba[j + 3] = 255;
  }
  return { id: message.id, ok: true, width: req.width, height: req.height, rgba, renderMs: performance.now() - t0 };
}

scope.onmessage = (event: MessageEvent<CpuRenderMessage>) => {
  render(event.data).then(
    (reply) => scope.postMessage(reply, reply.ok ? [reply.rgba.buffer] : []),
    (error: unknown) => scope.postMessage({ id: event.data.id, ok: false, error: error instanceof Error ? error.message : String(error) } satisfies CpuRenderReply),
  );
};
