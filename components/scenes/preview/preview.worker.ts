/// <reference lib="webworker" />
/**
 * The editor preview's CPU renderer: lib/render's pure core (prepareFrame +
 * renderBandLinear, lib/render/README.md) in a Web Worker, so typing and
 * scrubbing never wait on pixels. Sky assets come from the sky-assets API;
 * while they cannot be fetched the frame is drawn without stars and Milky Way
 * (the preview says so).
 */
import { prepareFrame, type SkyAssets } from '@/lib/render/frame';
import { renderBandLinear } from '@/lib/render/renderRows';
import { srgbEncode8 } from '@/lib/render/toneMap';
import { decodeCatalogue, type StarCatalogue } from '@/lib/render/starCatalogue';
import { decodeBrightnessMap } from '@/lib/webgl/skyAssetFormat';
import type { PreviewRenderMessage, PreviewRenderReply } from './preview-protocol';

const scope = self as unknown as DedicatedWorkerGlobalScope;

type Loaded = { catalogue: StarCatalogue; milkyWay: { width: number; height: number; data: Float32Array } } | null;
let assets: Promise<Loaded> | null = null;

async function bytes(url: string): Promise<Uint8Array> {
  const res = await fetch(url, { credentials: 'same-origin' });
  if (!res.ok) throw new Error(`HTTP ${res.status}`);
  return new Uint8Array(await res.arrayBuffer());
}

function loadAssets(base: string): Promise<Loaded> {
  assets ??= Promise.all([bytes(`${base}/stars-8`), bytes(`${base}/milky-way`)]).then(
    ([stars, mw]) => ({ catalogue: decodeCatalogue(stars), milkyWay: decodeBrightnessMap(mw) }),
    () => null,
  );
  return assets;
}

async function render(message: PreviewRenderMessage): Promise<PreviewRenderReply> {
  const req = message.request;
  const wantsSky = req.sky.stars.enabled || req.sky.milkyWay.enabled;
  const loaded = wantsSky ? await loadAssets(message.assetBase) : null;
  const sky: SkyAssets = {};
  let frameReq = { ...req, sky: { ...req.sky, panorama: undefined } };
  if (loaded) {
    if (req.sky.stars.enabled) sky.catalogue = loaded.catalogue;
    if (req.sky.milkyWay.enabled) sky.milkyWay = loaded.milkyWay;
  } else if (wantsSky) {
    frameReq = { ...frameReq, sky: { ...frameReq.sky, stars: { ...frameReq.sky.stars, enabled: false }, milkyWay: { ...frameReq.sky.milkyWay, enabled: false } } };
  }
  const t0 = performance.now();
  const plan = prepareFrame(frameReq, sky);
  const linear = renderBandLinear(plan, { y0: 0, y1: req.height });
  const rgba = new Uint8ClampedArray(req.width * req.height * 4);
  for (let i = 0, j = 0; i < linear.length; i += 3, j += 4) {
    rgba[j] = srgbEncode8(linear[i]);
    rgba[j + 1] = srgbEncode8(linear[i + 1]);
    rgba[j + 2] = srgbEncode8(linear[i + 2]);
    rgba[j + 3] = 255;
  }
  return { id: message.id, ok: true, width: req.width, height: req.height, rgba, renderMs: performance.now() - t0, skyMissing: wantsSky && !loaded };
}

scope.onmessage = (event: MessageEvent<PreviewRenderMessage>) => {
  render(event.data).then(
    (reply) => scope.postMessage(reply, reply.ok ? [reply.rgba.buffer] : []),
    (error: unknown) => scope.postMessage({ id: event.data.id, ok: false, error: error instanceof Error ? error.message : String(error) } satisfies PreviewRenderReply),
  );
};
