import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assertTestDatabase, closeDatabase } from '../../support/db';
import { makeMember, makeStudioWithCast, sessionCookie } from '../../support/factories';
import { callRoute } from '../../support/route';
import * as shows from '@/app/api/v1/studios/[studio]/shows/route';
import * as showScenes from '@/app/api/v1/studios/[studio]/shows/[showId]/scenes/route';
import * as revisions from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/revisions/route';
import * as revision from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/revisions/[number]/route';
import * as readout from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/revisions/[number]/readout/route';
import * as diff from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/diff/route';
import { defaultSceneSpec } from '@/lib/scenes/defaults';
import { sceneSpecSchema, toWorldlineSpec } from '@/lib/scenes/schema';
import { contentHash } from '@/lib/scenes/hash';
import { buildWorldline, sampleWorldline } from '@/lib/relativity';
import { SceneRevision, sequelize } from '@/models';

beforeAll(assertTestDatabase);
afterAll(closeDatabase);

async function sceneWithProducers() {
  const world = await makeStudioWithCast();
  const second = await makeMember(world.studio, 'producer');
  const cookieA = await sessionCookie(world.cast.producer.user);
  const cookieB = await sessionCookie(second.user);
  const s = world.studio.slug;
  const showRes = await callRoute(shows.POST, 'POST', '/x', { params: { studio: s }, body: { name: 'The Long Fall' }, cookie: cookieA });
  const showId = (showRes.json!.show as { id: string }).id;
  const sceneRes = await callRoute(showScenes.POST, 'POST', '/x', { params: { studio: s, showId }, body: { name: 'Approach' }, cookie: cookieA });
  expect(sceneRes.status).toBe(201);
  const sceneId = (sceneRes.json!.scene as { id: string }).id;
  return { world, s, showId, sceneId, cookieA, cookieB };
}

const editedSpec = (r: number) => {
  const spec = sceneSpecSchema.parse(defaultSceneSpec());
  spec.path.segments = [{ kind: 'hover', r, duration: 100 }];
  return spec;
};

describe('scene revisions API', () => {
  it('should keep both revisions when two producers save edits of the same revision at once', async () => {
    const { s, sceneId, cookieA, cookieB } = await sceneWithProducers();
    const [a, b] = await Promise.all([
      callRoute(revisions.POST, 'POST', '/x', { params: { studio: s, sceneId }, body: { basedOn: 1, spec: editedSpec(30) }, cookie: cookieA }),
      callRoute(revisions.POST, 'POST', '/x', { params: { studio: s, sceneId }, body: { basedOn: 1, spec: editedSpec(50) }, cookie: cookieB }),
    ]);
    expect([a.status, b.status]).toEqual([201, 201]);
    const numbers = [a, b].map((r) => (r.json!.revision as { number: number }).number).sort();
    expect(numbers).toEqual([2, 3]);
    expect([a, b].map((r) => r.json!.superseded).sort()).toEqual([false, true]);

    const list = await callRoute(revisions.GET, 'GET', '/x', { params: { studio: s, sceneId }, cookie: cookieA });
    expect((list.json!.revisions as { number: number; basedOn: number | null }[]).map((r) => [r.number, r.basedOn])).toEqual([[3, 1], [2, 1], [1, null]]);
    const radii = await Promise.all([2, 3].map(async (n) => {
      const res = await callRoute(revision.GET, 'GET', '/x', { params: { studio: s, sceneId, number: String(n) }, cookie: cookieA });
      return (res.json!.revision as { spec: { path: { segments: { r: number }[] } } }).spec.path.segments[0].r;
    }));
    expect(radii.sort()).toEqual([30, 50]);
  });

  it('should store the content hash of the canonical spec and refuse to update a revision in the database', async () => {
    const { s, sceneId, cookieA } = await sceneWithProducers();
    const res = await callRoute(revision.GET, 'GET', '/x', { params: { studio: s, sceneId, number: '1' }, cookie: cookieA });
    const stored = res.json!.revision as { contentHash: string; spec: unknown };
    expect(stored.contentHash).toBe(contentHash(stored.spec));
    await expect(sequelize.query('UPDATE scene_revisions SET message = \'x\' WHERE scene_id = :sceneId', { replacements: { sceneId } })).rejects.toThrow(/immutable/);
  });

  it('should name the field for a physically impossible edit and save nothing', async () => {
    const { s, sceneId, cookieA } = await sceneWithProducers();
    const spec = editedSpec(30) as unknown as { path: { segments: unknown[] } };
    spec.path.segments = [{ kind: 'circular-orbit', r: 2.5, duration: 10 }];
    const res = await callRoute(revisions.POST, 'POST', '/x', { params: { studio: s, sceneId }, body: { basedOn: 1, spec }, cookie: cookieA });
    expect(res.status).toBe(400);
    expect(res.json!.errors).toContainEqual({ field: 'spec.path.segments.0.r', message: 'a circular orbit must lie outside the photon sphere: r > 3 M (1.5 r_s)' });
    expect(await SceneRevision.count({ where: { sceneId } })).toBe(1);
  });

  it('should list exactly the changed fields between two revisions', async () => {
    const { s, sceneId, cookieA } = await sceneWithProducers();
    await callRoute(revisions.POST, 'POST', '/x', { params: { studio: s, sceneId }, body: { basedOn: 1, spec: editedSpec(30) }, cookie: cookieA });
    const res = await callRoute(diff.GET, 'GET', '/x', { params: { studio: s, sceneId }, query: { from: '1', to: '2' }, cookie: cookieA });
    expect(res.status).toBe(200);
    expect(res.json!.changes).toEqual([{ pointer: '/path/segments/0/r', change: 'changed', before: 80, after: 30 }]);
  });

  it('should give readouts that are the engine\'s own numbers for that proper time', async () => {
    const { s, sceneId, cookieA } = await sceneWithProducers();
    const spec = editedSpec(30);
    spec.path.segments = [{ kind: 'drop', r: 30, duration: 100 }];
    await callRoute(revisions.POST, 'POST', '/x', { params: { studio: s, sceneId }, body: { basedOn: 1, spec }, cookie: cookieA });
    const res = await callRoute(readout.GET, 'GET', '/x', { params: { studio: s, sceneId, number: '2' }, query: { tau: '60' }, cookie: cookieA });
    expect(res.status).toBe(200);
    const engine = sampleWorldline(buildWorldline(toWorldlineSpec(spec)), 60);
    const got = res.json!.readout as { radiusM: number; countdownSeconds: number; orbitBand: string };
    expect(got.radiusM).toBeCloseTo(engine.state.r, 12);
    expect(got.countdownSeconds).toBeCloseTo(engine.properTimeLeftSeconds!, 9);
    expect(got.orbitBand).toBe(engine.orbitBand);

    const tooLate = await callRoute(readout.GET, 'GET', '/x', { params: { studio: s, sceneId, number: '2' }, query: { tau: '1000' }, cookie: cookieA });
    expect(tooLate.status).toBe(400);
    expect(tooLate.json!.detail).toMatch(/at most the path's length/);
  });

  it('should answer 404 for a scene of another studio, even to its own admin', async () => {
    const { sceneId } = await sceneWithProducers();
    const other = await makeStudioWithCast();
    const res = await callRoute(revisions.GET, 'GET', '/x', { params: { studio: other.studio.slug, sceneId }, cookie: await sessionCookie(other.cast.admin.user) });
    expect(res.status).toBe(404);
  });
});
