import { createHash } from 'node:crypto';
import { z } from 'zod';
import { apiRoute } from '@/lib/api/handler';
import { revisionParams } from '@/lib/api/scene-schemas';
import { badRequest } from '@/lib/errors';
import { renderFrameToImage } from '@/lib/render/node/renderFrame';
import { frameRequestAt, frameSizeFor } from '@/lib/scenes/frame-request';
import { sceneWorldline } from '@/lib/scenes/readout';
import { findRevision } from '@/lib/scenes/service';

export const runtime = 'nodejs';

/** Largest side of a review frame, px: rendered in the request's own thread, so kept small. */
const MAX_SIDE_PX = 640;
const side = (name: string) =>
  z.coerce
    .number({ error: `${name} must be a number of pixels` })
    .int(`${name} must be a whole number of pixels`)
    .min(16, `${name} must be at least 16 pixels`)
    .max(MAX_SIDE_PX, `${name} must be at most ${MAX_SIDE_PX} pixels: review frames are small previews; request a still under Renders for larger frames`);

const frameQuery = z.strictObject({
  tau: z.coerce.number({ error: 'tau must be a proper time in units of M' }).finite('tau must be a finite proper time').min(0, 'tau must be zero or more'),
  width: side('width').default(320),
  height: side('height').default(320),
  lensing: z.enum(['on', 'off'], { error: 'lensing must be on or off' }).default('on'),
});

/** Recently rendered frames by ETag (revisions are immutable, so an entry never goes stale). */
const recent = new Map<string, Buffer>();
const RECENT_LIMIT = 48;

function remember(etag: string, bytes: Buffer): void {
  recent.set(etag, bytes);
  if (recent.size > RECENT_LIMIT) recent.delete(recent.keys().next().value!);
}

function png(bytes: Buffer, etag: string): Response {
  return new Response(new Uint8Array(bytes), { status: 200, headers: { 'content-type': 'image/png', etag, 'cache-control': 'private, max-age=86400' } });
}

/**
 * The frame seen at proper time `tau` (M) on a revision's path, as a PNG
 * rendered by lib/render on the server: the review page's scrub view and the
 * accuracy report's key-moment frames. `lensing=off` shows the same view with
 * the bending of light switched off, for comparison. Dome and cube-face
 * frames are square (the smaller side wins). Cached by an ETag of the
 * revision's content hash and the parameters.
 */
export const GET = apiRoute({
  params: revisionParams,
  query: frameQuery,
  access: { studioAction: 'scenes.read' },
  handler: async ({ request, access, params, query }) => {
    const revision = await findRevision(access!.studio.id, params.sceneId, params.number);
    const spec = revision.spec;
    const worldline = sceneWorldline(spec);
    if (query.tau > worldline.duration) throw badRequest(`tau must be at most the path's length, ${worldline.duration.toPrecision(6)} M.`, { errors: [{ field: 'tau', message: `at most ${worldline.duration.toPrecision(6)}` }] });
    const size = frameSizeFor(spec.projection, query.width, query.height);
    const etag = `"${createHash('sha256').update([revision.contentHash, query.tau, size.width, size.height, query.lensing].join('|')).digest('hex').slice(0, 32)}"`;
    if (request.headers.get('if-none-match') === etag) return new Response(null, { status: 304, headers: { etag, 'cache-control': 'private, max-age=86400' } });
    const cached = recent.get(etag);
    if (cached) return png(cached, etag);
    const frame = frameRequestAt(spec, worldline, query.tau, size);
    if (query.lensing === 'off') frame.effects.lensing = false;
    const image = await renderFrameToImage(frame, { threads: 0 });
    remember(etag, image.bytes);
    return png(image.bytes, etag);
  },
});
