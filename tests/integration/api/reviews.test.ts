import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assertTestDatabase, closeDatabase } from '../../support/db';
import { makeStudioWithCast, sessionCookie } from '../../support/factories';
import { callRoute } from '../../support/route';
import { waitForMessageTo } from '../../support/mailbox';
import * as reviews from '@/app/api/v1/studios/[studio]/reviews/route';
import * as review from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/route';
import * as notes from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/notes/route';
import * as note from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/notes/[noteId]/route';
import * as approve from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/approve/route';
import * as requestChanges from '@/app/api/v1/studios/[studio]/reviews/[reviewId]/request-changes/route';
import * as revisions from '@/app/api/v1/studios/[studio]/scenes/[sceneId]/revisions/route';
import { createScene, createShow } from '@/lib/scenes/service';
import { defaultSceneSpec } from '@/lib/scenes/defaults';
import { sceneSpecSchema } from '@/lib/scenes/schema';
import { approvalOf } from '@/lib/reviews/service';
import { Approval, AuditEvent, SceneRevision, sequelize } from '@/models';

beforeAll(assertTestDatabase);
afterAll(closeDatabase);

async function reviewWorld() {
  const world = await makeStudioWithCast();
  const show = await createShow(world.studio.id, world.cast.producer.user.id, 'Review show');
  const { scene } = await createScene(world.studio.id, world.cast.producer.user.id, show.id, 'Review scene', defaultSceneSpec());
  const cookies = {
    producer: await sessionCookie(world.cast.producer.user),
    advisor: await sessionCookie(world.cast.advisor.user),
    admin: await sessionCookie(world.cast.admin.user),
    operator: await sessionCookie(world.cast.operator.user),
  };
  const s = world.studio.slug;
  const submit = async (revision = 1, cookie = cookies.producer) => callRoute(reviews.POST, 'POST', '/x', { params: { studio: s }, cookie, body: { sceneId: scene.id, revision } });
  return { world, scene, cookies, s, submit };
}

describe('review workflow', () => {
  it('should let only producers and admins submit, e-mail the advisors a working link, and refuse a second open review', async () => {
    const { world, cookies, submit } = await reviewWorld();
    expect((await submit(1, cookies.advisor)).status).toBe(403);
    expect((await submit(1, cookies.operator)).status).toBe(403);
    const res = await submit();
    expect(res.status).toBe(201);
    expect((await submit()).status).toBe(409);

    const message = await waitForMessageTo(world.cast.advisor.user.email);
    const reviewId = (res.json!.review as { id: string }).id;
    expect(message.text).toContain(`/studios/${world.studio.slug}/reviews/${reviewId}`);
    expect(message.subject).toMatch(/Review requested: Review scene, revision 1/);
  });

  it('should refuse approval while a note is open, then approve once it is resolved, bound to the content hash', async () => {
    const { world, scene, cookies, s, submit } = await reviewWorld();
    const reviewId = ((await submit()).json!.review as { id: string }).id;
    const pinned = await callRoute(notes.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.advisor, body: { body: 'The shadow looks too small at 20 s.', tau: 40, point: { x: 0.5, y: 0.4 } } });
    expect(pinned.status).toBe(201);
    const noteId = (pinned.json!.note as { id: string }).id;
    // Producers reply but cannot pin new notes or resolve them.
    expect((await callRoute(notes.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.producer, body: { body: 'Fixed in the next revision?', parentId: noteId } })).status).toBe(201);
    expect((await callRoute(notes.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.producer, body: { body: 'A new note', tau: 10 } })).status).toBe(403);
    expect((await callRoute(note.PATCH, 'PATCH', '/x', { params: { studio: s, reviewId, noteId }, cookie: cookies.producer, body: { status: 'resolved' } })).status).toBe(403);

    const refused = await callRoute(approve.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.advisor });
    expect(refused.status).toBe(409);
    expect(refused.json!.detail).toBe('1 note is still open: resolve or accept it before approving.');
    expect((await callRoute(approve.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.admin })).status).toBe(403);

    expect((await callRoute(note.PATCH, 'PATCH', '/x', { params: { studio: s, reviewId, noteId }, cookie: cookies.advisor, body: { status: 'accepted' } })).status).toBe(200);
    const approved = await callRoute(approve.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.advisor });
    expect(approved.status).toBe(201);
    const revision = (await SceneRevision.findOne({ where: { sceneId: scene.id, number: 1 } }))!;
    expect((approved.json!.approval as { contentHash: string }).contentHash).toBe(revision.contentHash);
    expect(await AuditEvent.findOne({ where: { action: 'review.approved', targetId: revision.id } })).not.toBeNull();
    await expect(sequelize.query('UPDATE approvals SET content_hash = \'x\' WHERE revision_id = :id', { replacements: { id: revision.id } })).rejects.toThrow(/immutable/);

    const mail = await waitForMessageTo(world.cast.producer.user.email);
    expect(mail.subject).toMatch(/^Approved: Review scene, revision 1/);
  });

  it('should start every new revision unapproved and show the diff from the last approved one', async () => {
    const { scene, cookies, s, submit } = await reviewWorld();
    const reviewId = ((await submit()).json!.review as { id: string }).id;
    await callRoute(approve.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.advisor });
    const spec = sceneSpecSchema.parse(defaultSceneSpec());
    spec.massSolar = 12;
    expect((await callRoute(revisions.POST, 'POST', '/x', { params: { studio: s, sceneId: scene.id }, cookie: cookies.producer, body: { basedOn: 1, spec } })).status).toBe(201);
    const second = (await SceneRevision.findOne({ where: { sceneId: scene.id, number: 2 } }))!;
    expect(await approvalOf(second.id)).toBeNull();
    expect(await Approval.count({ where: { sceneId: scene.id } })).toBe(1);

    const again = await submit(2);
    const detail = await callRoute(review.GET, 'GET', '/x', { params: { studio: s, reviewId: (again.json!.review as { id: string }).id }, cookie: cookies.advisor });
    expect(detail.json!.diffFromApproved).toEqual({ from: 1, changes: [{ pointer: '/massSolar', change: 'changed', before: 4.1e6, after: 12 }] });
    expect(detail.json!.approval).toBeNull();
  });

  it('should let an advisor ask for changes, e-mail the producer the message, and close the review', async () => {
    const { world, cookies, s, submit } = await reviewWorld();
    const reviewId = ((await submit()).json!.review as { id: string }).id;
    expect((await callRoute(requestChanges.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.producer, body: { message: 'x' } })).status).toBe(403);
    const res = await callRoute(requestChanges.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.advisor, body: { message: 'Slow the last second down.' } });
    expect(res.status).toBe(200);
    const mail = await waitForMessageTo(world.cast.producer.user.email);
    expect(mail.text).toContain('Slow the last second down.');
    expect(mail.text).toContain(`/studios/${world.studio.slug}/reviews/${reviewId}`);
    expect((await callRoute(approve.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.advisor })).status).toBe(409);
    expect((await submit()).status).toBe(201); // resubmitting the same revision opens a new review
  });

  it('should refuse a note pinned past the end of the path', async () => {
    const { cookies, s, submit } = await reviewWorld();
    const reviewId = ((await submit()).json!.review as { id: string }).id;
    const res = await callRoute(notes.POST, 'POST', '/x', { params: { studio: s, reviewId }, cookie: cookies.advisor, body: { body: 'Too late', tau: 5000 } });
    expect(res.status).toBe(400);
    expect(res.json!.detail).toMatch(/tau must lie on the path/);
  });
});
