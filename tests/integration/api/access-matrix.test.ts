import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assertTestDatabase, closeDatabase } from '../../support/db';
import { makeMember, makeStudioWithCast, sessionCookie } from '../../support/factories';
import { callRoute } from '../../support/route';
import * as me from '@/app/api/v1/me/route';
import * as skyAssets from '@/app/api/v1/sky-assets/[name]/route';
import * as members from '@/app/api/v1/studios/[studio]/members/route';
import * as member from '@/app/api/v1/studios/[studio]/members/[memberId]/route';
import * as invitations from '@/app/api/v1/studios/[studio]/invitations/route';
import * as emails from '@/app/api/v1/studios/[studio]/emails/route';
import * as auditEvents from '@/app/api/v1/studios/[studio]/audit-events/route';
import * as accept from '@/app/api/v1/invitations/accept/route';
import * as shows from '@/app/api/v1/studios/[studio]/shows/route';
import * as show from '@/app/api/v1/studios/[studio]/shows/[showId]/route';
import * as showScenes from '@/app/api/v1/studios/[studio]/shows/[showId]/scenes/route';
import * as scene from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/route';
import * as revisions from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/revisions/route';
import * as revision from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/revisions/[number]/route';
import * as readout from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/revisions/[number]/readout/route';
import * as diff from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/diff/route';
import * as revisionFrame from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/revisions/[number]/frame/route';
import { createScene, createShow } from '@/lib/scenes/service';
import { defaultSceneSpec } from '@/lib/scenes/defaults';
import { sceneSpecSchema } from '@/lib/scenes/schema';
import * as renders from '@/app/api/v1/studios/[studio]/renders/route';
import * as render from '@/app/api/v1/studios/[studio]/renders/[renderId]/route';
import * as renderCancel from '@/app/api/v1/studios/[studio]/renders/[renderId]/cancel/route';
import * as renderRetry from '@/app/api/v1/studios/[studio]/renders/[renderId]/retry/route';
import * as renderFrame from '@/app/api/v1/studios/[studio]/renders/[renderId]/frames/[index]/route';
import * as deliveries from '@/app/api/v1/studios/[studio]/deliveries/route';
import * as delivery from '@/app/api/v1/studios/[studio]/deliveries/[deliveryId]/route';
import * as deliveryDownload from '@/app/api/v1/studios/[studio]/deliveries/[deliveryId]/download/route';
import * as deliveryLoaded from '@/app/api/v1/studios/[studio]/deliveries/[deliveryId]/loaded/route';
import { makeRenderWithDelivery } from '../../support/render-factories';
import { ensureBucket } from '@/lib/storage/s3';
import { stopQueue } from '@/lib/queue/boss';
import { RenderJob, Review, ReviewNote, SceneRevision } from '@/models';
import * as reviewsRoute from '@/app/api/v1/studios/[studio]/reviews/route';
import * as reviewRoute from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/route';
import * as reviewNotes from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/notes/route';
import * as reviewNote from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/notes/[noteId]/route';
import * as reviewApprove from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/approve/route';
import * as reviewChanges from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/request-changes/route';

// Every /api/v1 route x every role x a person from another studio x nobody.
// The expected statuses are the product's role table (product.md, People and roles).
type Who = 'admin' | 'producer' | 'advisor' | 'operator' | 'foreign' | 'anonymous';
type Case = { studio: string; memberId: string; showId: string; sceneId: string; renderId: string; deliveryId: string; reviewId: string; noteId: string };
type Entry = {
  file: string;
  method: 'GET' | 'POST' | 'PATCH' | 'DELETE';
  handler: Parameters<typeof callRoute>[0];
  params: (c: Case) => Record<string, string>;
  body?: () => unknown;
  query?: Record<string, string>;
  expected: Record<Who, number>;
};

const adminOnly = (ok: number): Record<Who, number> => ({ admin: ok, producer: 403, advisor: 403, operator: 403, foreign: 404, anonymous: 401 });
const everyMember = (ok: number): Record<Who, number> => ({ admin: ok, producer: ok, advisor: ok, operator: ok, foreign: 404, anonymous: 401 });
const producers = (ok: number): Record<Who, number> => ({ admin: ok, producer: ok, advisor: 403, operator: 403, foreign: 404, anonymous: 401 });
// Operators read approved scenes only; approvals do not exist yet, so scene content is closed to them.
const sceneReaders = (ok: number): Record<Who, number> => ({ admin: ok, producer: ok, advisor: ok, operator: 403, foreign: 404, anonymous: 401 });
const advisorsOnly = (ok: number): Record<Who, number> => ({ admin: 403, producer: 403, advisor: ok, operator: 403, foreign: 404, anonymous: 401 });
const specBody = () => sceneSpecSchema.parse(defaultSceneSpec());
let counter = 0;

const MATRIX: Entry[] = [
  // Star catalogue and Milky Way map for the browser's renderers: any signed-in person, no studio data.
  { file: 'sky-assets/[name]/route.ts', method: 'GET', handler: skyAssets.GET, params: () => ({ name: 'milky-way' }), expected: { admin: 200, producer: 200, advisor: 200, operator: 200, foreign: 200, anonymous: 401 } },
  { file: 'me/route.ts', method: 'GET', handler: me.GET, params: () => ({}), expected: { admin: 200, producer: 200, advisor: 200, operator: 200, foreign: 200, anonymous: 401 } },
  { file: 'studios/[studio]/members/route.ts', method: 'GET', handler: members.GET, params: (c) => ({ studio: c.studio }), expected: adminOnly(200) },
  { file: 'studios/[studio]/members/[memberId]/route.ts', method: 'PATCH', handler: member.PATCH, params: (c) => ({ studio: c.studio, memberId: c.memberId }), body: () => ({ role: 'advisor' }), expected: adminOnly(200) },
  { file: 'studios/[studio]/members/[memberId]/route.ts', method: 'DELETE', handler: member.DELETE, params: (c) => ({ studio: c.studio, memberId: c.memberId }), expected: adminOnly(204) },
  { file: 'studios/[studio]/invitations/route.ts', method: 'GET', handler: invitations.GET, params: (c) => ({ studio: c.studio }), expected: adminOnly(200) },
  { file: 'studios/[studio]/invitations/route.ts', method: 'POST', handler: invitations.POST, params: (c) => ({ studio: c.studio }), body: () => ({ email: `matrix-${++counter}-${Date.now()}@example.test`, role: 'operator' }), expected: adminOnly(201) },
  { file: 'studios/[studio]/emails/route.ts', method: 'GET', handler: emails.GET, params: (c) => ({ studio: c.studio }), expected: adminOnly(200) },
  { file: 'studios/[studio]/audit-events/route.ts', method: 'GET', handler: auditEvents.GET, params: (c) => ({ studio: c.studio }), expected: adminOnly(200) },
  { file: 'studios/[studio]/shows/route.ts', method: 'GET', handler: shows.GET, params: (c) => ({ studio: c.studio }), expected: everyMember(200) },
  { file: 'studios/[studio]/shows/route.ts', method: 'POST', handler: shows.POST, params: (c) => ({ studio: c.studio }), body: () => ({ name: 'Matrix show' }), expected: producers(201) },
  { file: 'studios/[studio]/shows/[showId]/route.ts', method: 'GET', handler: show.GET, params: (c) => ({ studio: c.studio, showId: c.showId }), expected: everyMember(200) },
  { file: 'studios/[studio]/shows/[showId]/route.ts', method: 'PATCH', handler: show.PATCH, params: (c) => ({ studio: c.studio, showId: c.showId }), body: () => ({ name: 'Renamed show' }), expected: producers(200) },
  { file: 'studios/[studio]/shows/[showId]/scenes/route.ts', method: 'GET', handler: showScenes.GET, params: (c) => ({ studio: c.studio, showId: c.showId }), expected: sceneReaders(200) },
  { file: 'studios/[studio]/shows/[showId]/scenes/route.ts', method: 'POST', handler: showScenes.POST, params: (c) => ({ studio: c.studio, showId: c.showId }), body: () => ({ name: 'Matrix scene' }), expected: producers(201) },
  { file: 'studios/[studio]/scenes/[sceneId]/route.ts', method: 'GET', handler: scene.GET, params: (c) => ({ studio: c.studio, sceneId: c.sceneId }), expected: sceneReaders(200) },
  { file: 'studios/[studio]/scenes/[sceneId]/route.ts', method: 'PATCH', handler: scene.PATCH, params: (c) => ({ studio: c.studio, sceneId: c.sceneId }), body: () => ({ archived: true }), expected: producers(200) },
  { file: 'studios/[studio]/scenes/[sceneId]/revisions/route.ts', method: 'GET', handler: revisions.GET, params: (c) => ({ studio: c.studio, sceneId: c.sceneId }), expected: sceneReaders(200) },
  { file: 'studios/[studio]/scenes/[sceneId]/revisions/route.ts', method: 'POST', handler: revisions.POST, params: (c) => ({ studio: c.studio, sceneId: c.sceneId }), body: () => ({ basedOn: 1, spec: specBody() }), expected: producers(201) },
  { file: 'studios/[studio]/scenes/[sceneId]/revisions/[number]/route.ts', method: 'GET', handler: revision.GET, params: (c) => ({ studio: c.studio, sceneId: c.sceneId, number: '1' }), expected: sceneReaders(200) },
  { file: 'studios/[studio]/scenes/[sceneId]/revisions/[number]/readout/route.ts', method: 'GET', handler: readout.GET, params: (c) => ({ studio: c.studio, sceneId: c.sceneId, number: '1' }), query: { tau: '10' }, expected: sceneReaders(200) },
  { file: 'studios/[studio]/scenes/[sceneId]/revisions/[number]/frame/route.ts', method: 'GET', handler: revisionFrame.GET, params: (c) => ({ studio: c.studio, sceneId: c.sceneId, number: '1' }), query: { tau: '10', width: '16', height: '16' }, expected: sceneReaders(200) },
  { file: 'studios/[studio]/scenes/[sceneId]/diff/route.ts', method: 'GET', handler: diff.GET, params: (c) => ({ studio: c.studio, sceneId: c.sceneId }), query: { from: '1', to: '1' }, expected: sceneReaders(200) },
  { file: 'studios/[studio]/renders/route.ts', method: 'GET', handler: renders.GET, params: (c) => ({ studio: c.studio }), expected: sceneReaders(200) },
  { file: 'studios/[studio]/renders/route.ts', method: 'POST', handler: renders.POST, params: (c) => ({ studio: c.studio }), body: () => 'still-request', expected: producers(201) },
  { file: 'studios/[studio]/renders/[renderId]/route.ts', method: 'GET', handler: render.GET, params: (c) => ({ studio: c.studio, renderId: c.renderId }), expected: sceneReaders(200) },
  { file: 'studios/[studio]/renders/[renderId]/cancel/route.ts', method: 'POST', handler: renderCancel.POST, params: (c) => ({ studio: c.studio, renderId: c.renderId }), expected: producers(200) },
  { file: 'studios/[studio]/renders/[renderId]/retry/route.ts', method: 'POST', handler: renderRetry.POST, params: (c) => ({ studio: c.studio, renderId: c.renderId }), expected: producers(200) },
  { file: 'studios/[studio]/renders/[renderId]/frames/[index]/route.ts', method: 'GET', handler: renderFrame.GET, params: (c) => ({ studio: c.studio, renderId: c.renderId, index: '0' }), expected: sceneReaders(200) },
  { file: 'studios/[studio]/deliveries/route.ts', method: 'GET', handler: deliveries.GET, params: (c) => ({ studio: c.studio }), expected: everyMember(200) },
  { file: 'studios/[studio]/deliveries/[deliveryId]/route.ts', method: 'GET', handler: delivery.GET, params: (c) => ({ studio: c.studio, deliveryId: c.deliveryId }), expected: everyMember(200) },
  { file: 'studios/[studio]/deliveries/[deliveryId]/download/route.ts', method: 'GET', handler: deliveryDownload.GET, params: (c) => ({ studio: c.studio, deliveryId: c.deliveryId }), expected: everyMember(200) },
  { file: 'studios/[studio]/deliveries/[deliveryId]/loaded/route.ts', method: 'POST', handler: deliveryLoaded.POST, params: (c) => ({ studio: c.studio, deliveryId: c.deliveryId }), expected: { admin: 200, producer: 403, advisor: 403, operator: 200, foreign: 404, anonymous: 401 } },
  { file: 'studios/[studio]/reviews/route.ts', method: 'GET', handler: reviewsRoute.GET, params: (c) => ({ studio: c.studio }), expected: sceneReaders(200) },
  { file: 'studios/[studio]/reviews/route.ts', method: 'POST', handler: reviewsRoute.POST, params: (c) => ({ studio: c.studio }), body: () => 'review-request', expected: producers(201) },
  { file: 'studios/[studio]/reviews/[reviewId]/route.ts', method: 'GET', handler: reviewRoute.GET, params: (c) => ({ studio: c.studio, reviewId: c.reviewId }), expected: sceneReaders(200) },
  // Only advisors pin new notes and decide; producers and admins reply in threads (tests/integration/api/reviews.test.ts).
  { file: 'studios/[studio]/reviews/[reviewId]/notes/route.ts', method: 'POST', handler: reviewNotes.POST, params: (c) => ({ studio: c.studio, reviewId: c.reviewId }), body: () => ({ body: 'Check the ring radius here.', tau: 10 }), expected: advisorsOnly(201) },
  { file: 'studios/[studio]/reviews/[reviewId]/notes/[noteId]/route.ts', method: 'PATCH', handler: reviewNote.PATCH, params: (c) => ({ studio: c.studio, reviewId: c.reviewId, noteId: c.noteId }), body: () => ({ status: 'resolved' }), expected: advisorsOnly(200) },
  { file: 'studios/[studio]/reviews/[reviewId]/approve/route.ts', method: 'POST', handler: reviewApprove.POST, params: (c) => ({ studio: c.studio, reviewId: c.reviewId }), expected: advisorsOnly(201) },
  { file: 'studios/[studio]/reviews/[reviewId]/request-changes/route.ts', method: 'POST', handler: reviewChanges.POST, params: (c) => ({ studio: c.studio, reviewId: c.reviewId }), body: () => ({ message: 'Slower, please.' }), expected: advisorsOnly(200) },
  // Public by design: the token is the proof. An unknown token is 404 for everyone alike.
  { file: 'invitations/accept/route.ts', method: 'POST', handler: accept.POST, params: () => ({}), body: () => ({ token: 'x'.repeat(43), password: 'long-enough-password' }), expected: { admin: 404, producer: 404, advisor: 404, operator: 404, foreign: 404, anonymous: 404 } },
];

const revisionOne = async (sceneId: string) => (await SceneRevision.findOne({ where: { sceneId, number: 1 } }))!;
let world: Awaited<ReturnType<typeof makeStudioWithCast>>;
const cookies = {} as Record<Who, string | undefined>;

beforeAll(async () => {
  assertTestDatabase();
  await ensureBucket();
  world = await makeStudioWithCast();
  for (const role of ['admin', 'producer', 'advisor', 'operator'] as const) cookies[role] = await sessionCookie(world.cast[role].user);
  cookies.foreign = await sessionCookie(world.foreigner.user);
  cookies.anonymous = undefined;
});
afterAll(async () => {
  // Renders requested by the matrix are cancelled so no worker picks them up later.
  await RenderJob.update({ status: 'cancelled' }, { where: { studioId: world.studio.id, status: 'queued' } });
  await stopQueue();
  await closeDatabase();
});

describe('access-control matrix for /api/v1', () => {
  it('should list every exported handler under app/api/v1', () => {
    const root = path.resolve('app/api/v1');
    const found: string[] = [];
    const walk = (dir: string) => {
      for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
        const full = path.join(dir, entry.name);
        if (entry.isDirectory()) walk(full);
        else if (entry.name === 'route.ts') {
          for (const m of fs.readFileSync(full, 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)) {
            found.push(`${m[1]} ${path.relative(root, full)}`);
          }
        }
      }
    };
    walk(root);
    const covered = MATRIX.map((e) => `${e.method} ${e.file}`);
    expect(found.sort()).toEqual([...new Set(covered)].sort());
  });

  for (const entry of MATRIX) {
    for (const who of Object.keys(entry.expected) as Who[]) {
      it(`should answer ${entry.expected[who]} to ${who} for ${entry.method} ${entry.file}`, async () => {
        // A fresh disposable member per case, so role changes and removals do not affect other cases.
        const target = await makeMember(world.studio, 'producer');
        const owner = world.cast.producer.user.id;
        const newShow = await createShow(world.studio.id, owner, 'Matrix show');
        const { scene: newScene } = await createScene(world.studio.id, owner, newShow.id, 'Matrix scene', defaultSceneSpec());
        const fixtures = entry.file.includes('renders/[renderId]') || entry.file.includes('deliveries/[deliveryId]')
          ? await makeRenderWithDelivery(world.studio, newScene.id, owner, entry.file.includes('/cancel/') ? 'running' : 'cancelled')
          : null;
        const reviewFixture = entry.file.includes('reviews/[reviewId]')
          ? await Review.create({ studioId: world.studio.id, sceneId: newScene.id, revisionId: (await revisionOne(newScene.id)).id, advisorIds: [], message: null, submittedById: owner, decidedById: null, decidedAt: null, decisionNote: null })
          : null;
        const noteFixture = reviewFixture && entry.file.includes('[noteId]')
          ? await ReviewNote.create({ studioId: world.studio.id, reviewId: reviewFixture.id, parentId: null, authorId: world.cast.advisor.user.id, tau: 1, pointX: null, pointY: null, body: 'Fixture note', statusChangedById: null })
          : null;
        const studio = world.studio.slug; // the foreigner asks about a studio they do not belong to
        const raw = entry.body?.();
        const body = raw === 'review-request' ? { sceneId: newScene.id, revision: 1 } : raw;
        const result = await callRoute(entry.handler, entry.method, `/api/v1/${entry.file}`, {
          params: entry.params({ studio, memberId: target.membership.id, showId: newShow.id, sceneId: newScene.id, renderId: fixtures?.job.id ?? '', deliveryId: fixtures?.delivery.id ?? '', reviewId: reviewFixture?.id ?? '', noteId: noteFixture?.id ?? '' }),
          body: body === 'still-request' ? { sceneId: newScene.id, revision: 1, kind: 'still', settings: { width: 16, height: 16 } } : body,
          query: entry.query,
          cookie: cookies[who],
        });
        expect(result.status, JSON.stringify(result.json)).toBe(entry.expected[who]);
        if (result.status >= 400) expect(result.contentType).toBe('application/problem+json');
      });
    }
  }
});
