import { createHash } from 'node:crypto';
import { apiRoute } from '@/lib/api/handler';
import { loadMilkyWayMap, loadStarCatalogue } from '@/lib/render/node/assets';
import { encodeCatalogue } from '@/lib/render/starCatalogue';
import { encodeBrightnessMap } from '@/lib/webgl/skyAssetFormat';
import { skyAssetParams } from './schema';

export const runtime = 'nodejs';

type Encoded = { bytes: Uint8Array; etag: string };
const encoded = new Map<string, Encoded>();

/** Encode an asset once per process (the sources are cached under .data/cache by lib/render/node). */
function assetBytes(name: 'stars-8' | 'milky-way'): Encoded {
  let hit = encoded.get(name);
  if (!hit) {
    const bytes = name === 'stars-8' ? encodeCatalogue(loadStarCatalogue()) : encodeBrightnessMap(loadMilkyWayMap());
    hit = { bytes, etag: `"${createHash('sha256').update(bytes).digest('hex').slice(0, 32)}"` };
    encoded.set(name, hit);
  }
  return hit;
}

/**
 * Sky data for the browser's sky view and its CPU worker (signed-in people only):
 * the d3-celestial star catalogue in lib/render's SKYSTAR1 form and the Milky Way
 * map in lib/webgl's SKYMWMP1 form. They change only with the installed package,
 * so browsers keep them for a long time.
 */
export const GET = apiRoute({
  params: skyAssetParams,
  access: 'signed-in',
  handler: async ({ params, request }) => {
    const { bytes, etag } = assetBytes(params.name);
    const headers = {
      'content-type': 'application/octet-stream',
      'cache-control': 'private, max-age=31536000, immutable',
      etag,
    };
    if (request.headers.get('if-none-match') === etag) return new Response(null, { status: 304, headers });
    return new Response(bytes as unknown as BodyInit, { status: 200, headers: { ...headers, 'content-length': String(bytes.byteLength) } });
  },
});
