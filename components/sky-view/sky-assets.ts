/**
 * Fetches and decodes the sky assets (star catalogue in lib/render's SKYSTAR1
 * form, Milky Way map in lib/webgl's SKYMWMP1 form) from the sky-assets API,
 * once per base URL per thread. Works in the page and in the CPU worker.
 */
import { decodeCatalogue, type StarCatalogue } from '@/lib/render/starCatalogue';
import { decodeBrightnessMap, type BrightnessMap } from '@/lib/webgl/skyAssetFormat';

/** Default location of the assets (app/api/v1/sky-assets/[name]/route.ts). */
export const DEFAULT_SKY_ASSET_BASE = '/api/v1/sky-assets';

/** Decoded sky assets. */
export interface DecodedSkyAssets {
  catalogue: StarCatalogue;
  milkyWay: BrightnessMap;
}

const cache = new Map<string, Promise<DecodedSkyAssets>>();

async function fetchBytes(url: string): Promise<Uint8Array> {
  const res = await fetch(url, { credentials: 'same-origin' });
  if (!res.ok) throw new Error(`sky asset ${url}: HTTP ${res.status}`);
  return new Uint8Array(await res.arrayBuffer());
}

/**
 * Load both assets.
 * @param base URL prefix of the sky-assets API (absolute inside workers)
 * @returns decoded catalogue and Milky Way map
 */
export function loadSkyAssets(base: string): Promise<DecodedSkyAssets> {
  let hit = cache.get(base);
  if (!hit) {
    hit = Promise.all([fetchBytes(`${base}/stars-8`), fetchBytes(`${base}/milky-way`)]).then(([stars, mw]) => ({
      catalogue: decodeCatalogue(stars),
      milkyWay: decodeBrightnessMap(mw),
    }));
    hit.catch(() => cache.delete(base));
    cache.set(base, hit);
  }
  return hit;
}
