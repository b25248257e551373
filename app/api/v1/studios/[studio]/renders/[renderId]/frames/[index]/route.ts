import { Readable } from 'node:stream';
import sharp from 'sharp';
import { z } from 'zod';
import { apiRoute } from '@/lib/api/handler';
import { frameParams } from '@/lib/api/render-schemas';
import { getObjectBytes, getObjectStream } from '@/lib/storage/s3';
import { findFrame } from '@/lib/renders/views';

/** One stored frame, streamed from the object store (?size=thumb for a 256-pixel JPEG preview). */
export const GET = apiRoute({
  params: frameParams,
  query: z.strictObject({ size: z.enum(['full', 'thumb']).default('full') }),
  access: { studioAction: 'renders.read' },
  handler: async ({ access, params, query }) => {
    const frame = await findFrame(access!.studio.id, params.renderId, params.index);
    const headers = { 'cache-control': 'private, max-age=31536000, immutable', etag: `"${frame.sha256}"` };
    if (query.size === 'thumb') {
      const thumb = await sharp(await getObjectBytes(frame.objectKey)).resize(256, 256, { fit: 'inside' }).jpeg({ quality: 80 }).toBuffer();
      return new Response(new Uint8Array(thumb), { headers: { ...headers, 'content-type': 'image/jpeg' } });
    }
    const type = frame.objectKey.endsWith('.jpg') ? 'image/jpeg' : 'image/png';
    const body = Readable.toWeb(await getObjectStream(frame.objectKey)) as ReadableStream<Uint8Array>;
    return new Response(body, { headers: { ...headers, 'content-type': type, 'content-length': String(frame.bytes) } });
  },
});
