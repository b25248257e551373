import { createHash } from 'node:crypto';
import JSZip from 'jszip';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assertTestDatabase, closeDatabase } from '../../support/db';
import { makeStudioWithCast, sessionCookie } from '../../support/factories';
import { callRoute } from '../../support/route';
import { startWorker, stopWorker, waitFor } from '../../support/workers';
import * as renders from '@/app/api/v1/studios/[studio]/renders/route';
import * as cancel from '@/app/api/v1/studios/[studio]/renders/[renderId]/cancel/route';
import * as download from '@/app/api/v1/studios/[studio]/deliveries/[deliveryId]/download/route';
import { createScene, createShow } from '@/lib/scenes/service';
import { defaultSceneSpec } from '@/lib/scenes/defaults';
import { getObjectBytes, ensureBucket } from '@/lib/storage/s3';
import { stopQueue } from '@/lib/queue/boss';
import { Delivery, Frame, RenderJob } from '@/models';

// 12 frames: 0.4 s of screen time at 30 fps over a 100 M hover.
async function twelveFrameScene() {
  const world = await makeStudioWithCast();
  const owner = world.cast.producer.user.id;
  const show = await createShow(world.studio.id, owner, 'Farm show');
  const spec = defaultSceneSpec();
  spec.pacing = { frameRate: 30, points: [{ properTime: 0, screenTime: 0 }, { properTime: 100, screenTime: 0.4 }] };
  const { scene } = await createScene(world.studio.id, owner, show.id, 'Farm scene', spec);
  return { world, scene, cookie: await sessionCookie(world.cast.producer.user) };
}

async function requestSequence(slug: string, sceneId: string, cookie: string, side = 96) {
  const res = await callRoute(renders.POST, 'POST', '/x', { params: { studio: slug }, cookie, body: { sceneId, revision: 1, kind: 'sequence', settings: { width: side, height: side, format: 'png8' } } });
  expect(res.status, JSON.stringify(res.json)).toBe(201);
  return (res.json!.render as { id: string; frameCount: number });
}

const doneOrFailed = (id: string) => async () => {
  const job = await RenderJob.findByPk(id);
  return job && ((job.status === 'done' && job.photosensitivity) || job.status === 'failed') ? job : undefined;
};

beforeAll(async () => {
  assertTestDatabase();
  await ensureBucket();
});
afterAll(async () => {
  await stopQueue();
  await closeDatabase();
});

describe('render farm (PostgreSQL queue, worker processes, S3 fake)', () => {
  it('should render a 12-frame sequence whose manifest checksums match the stored objects, and stream it as a zip', async () => {
    const { world, scene, cookie } = await twelveFrameScene();
    const render = await requestSequence(world.studio.slug, scene.id, cookie);
    expect(render.frameCount).toBe(12);
    const worker = startWorker('farm-a');
    try {
      const job = await waitFor('the render to finish', doneOrFailed(render.id), 120_000);
      expect(job.status, worker.output.join('')).toBe('done');
    } finally {
      await stopWorker(worker);
    }
    const delivery = (await Delivery.findOne({ where: { renderJobId: render.id } }))!;
    expect(delivery.manifest.frames.map((f) => f.index)).toEqual([...Array(12).keys()]);
    const frames = await Frame.findAll({ where: { renderJobId: render.id } });
    for (const frame of frames) {
      const stored = await getObjectBytes(frame.objectKey);
      const sha = createHash('sha256').update(stored).digest('hex');
      expect(sha).toBe(frame.sha256);
      expect(delivery.manifest.frames.find((f) => f.index === frame.index)!.sha256).toBe(sha);
    }

    const res = await fetchZip(world.studio.slug, delivery.id, cookie);
    const zip = await JSZip.loadAsync(res);
    const manifest = JSON.parse(await zip.file('manifest.json')!.async('string'));
    expect(manifest.frames).toHaveLength(12);
    for (const entry of manifest.frames as { file: string; sha256: string }[]) {
      const bytes = await zip.file(`frames/${entry.file}`)!.async('uint8array');
      expect(createHash('sha256').update(bytes).digest('hex')).toBe(entry.sha256);
    }
    expect(manifest.frames[0].file).toBe('farm-scene_0000.png');
    expect(await zip.file('photosensitivity-report.txt')!.async('string')).toMatch(/Verdict: PASS/);
  }, 180_000);

  it('should finish with no missing or duplicated frame when a worker is killed mid-sequence and another takes over', async () => {
    const { world, scene, cookie } = await twelveFrameScene();
    const render = await requestSequence(world.studio.slug, scene.id, cookie, 256);
    const first = startWorker('farm-killed');
    await waitFor('three frames from the first worker', async () => ((await Frame.count({ where: { renderJobId: render.id } })) >= 3 ? true : undefined), 120_000);
    await stopWorker(first, 'SIGKILL');
    const second = startWorker('farm-second');
    try {
      const job = await waitFor('the second worker to finish the render', doneOrFailed(render.id), 150_000);
      expect(job.status, second.output.join('')).toBe('done');
    } finally {
      await stopWorker(second);
    }
    const frames = await Frame.findAll({ where: { renderJobId: render.id }, order: [['index', 'ASC']] });
    expect(frames.map((f) => f.index)).toEqual([...Array(12).keys()]);
    expect(new Set(frames.map((f) => f.worker))).toEqual(new Set(['farm-killed', 'farm-second']));
  }, 300_000);

  it('should stop rendering further frames once a render is cancelled', async () => {
    const { world, scene, cookie } = await twelveFrameScene();
    const render = await requestSequence(world.studio.slug, scene.id, cookie, 256);
    const worker = startWorker('farm-cancel');
    try {
      await waitFor('a first frame', async () => ((await Frame.count({ where: { renderJobId: render.id } })) >= 1 ? true : undefined), 120_000);
      const res = await callRoute(cancel.POST, 'POST', '/x', { params: { studio: world.studio.slug, renderId: render.id }, cookie });
      expect(res.status).toBe(200);
      const atCancel = await Frame.count({ where: { renderJobId: render.id } });
      await new Promise((r) => setTimeout(r, 4000));
      const later = await Frame.count({ where: { renderJobId: render.id } });
      expect(later).toBeLessThanOrEqual(atCancel + 1); // at most the frame in hand
      expect(later).toBeLessThan(12);
      expect((await RenderJob.findByPk(render.id))!.status).toBe('cancelled');
    } finally {
      await stopWorker(worker);
    }
  }, 200_000);

  it('should refuse requests past the limits with a 400 that names them', async () => {
    const { world, scene, cookie } = await twelveFrameScene();
    const tooBig = await callRoute(renders.POST, 'POST', '/x', { params: { studio: world.studio.slug }, cookie, body: { sceneId: scene.id, revision: 1, kind: 'still', settings: { width: 9000, height: 100 } } });
    expect(tooBig.status).toBe(400);
    expect(tooBig.json!.detail).toMatch(/at most 8192/);
    const outside = await callRoute(renders.POST, 'POST', '/x', { params: { studio: world.studio.slug }, cookie, body: { sceneId: scene.id, revision: 1, kind: 'sequence', frames: { start: 5, end: 40 }, settings: { width: 64, height: 64 } } });
    expect(outside.status).toBe(400);
    expect(outside.json!.detail).toMatch(/within 0 to 11/);
    const noRevision = await callRoute(renders.POST, 'POST', '/x', { params: { studio: world.studio.slug }, cookie, body: { sceneId: scene.id, revision: 9, kind: 'still', settings: { width: 64, height: 64 } } });
    expect(noRevision.status).toBe(404);
  });
});

async function fetchZip(studio: string, deliveryId: string, cookie: string): Promise<Uint8Array> {
  const response = await download.GET(new Request('http://localhost/x', { headers: { cookie } }), { params: Promise.resolve({ studio, deliveryId }) });
  expect(response.status).toBe(200);
  expect(response.headers.get('content-type')).toBe('application/zip');
  return new Uint8Array(await response.arrayBuffer());
}
