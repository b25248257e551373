import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assertTestDatabase, closeDatabase } from '../../support/db';
import { makeStudioWithCast, sessionCookie } from '../../support/factories';
import { makeRenderWithDelivery } from '../../support/render-factories';
import { callRoute } from '../../support/route';
import * as deliveries from '@/app/api/v1/studios/[studio]/deliveries/route';
import * as delivery from '@/app/api/v1/studios/[studio]/deliveries/[deliveryId]/route';
import * as download from '@/app/api/v1/studios/[studio]/deliveries/[deliveryId]/download/route';
import { createScene, createShow } from '@/lib/scenes/service';
import { defaultSceneSpec } from '@/lib/scenes/defaults';
import { ensureBucket } from '@/lib/storage/s3';

beforeAll(async () => {
  assertTestDatabase();
  await ensureBucket();
});
afterAll(closeDatabase);

describe('deliveries of unapproved revisions', () => {
  it('should stay invisible to operators (404) while producers and advisors see them marked as drafts', async () => {
    const world = await makeStudioWithCast();
    const show = await createShow(world.studio.id, world.cast.producer.user.id, 'Draft show');
    const { scene } = await createScene(world.studio.id, world.cast.producer.user.id, show.id, 'Draft scene', defaultSceneSpec());
    const draft = await makeRenderWithDelivery(world.studio, scene.id, world.cast.producer.user.id, 'cancelled', false);
    const s = world.studio.slug;
    const operator = await sessionCookie(world.cast.operator.user);
    const advisor = await sessionCookie(world.cast.advisor.user);

    const seenByOperator = await callRoute(deliveries.GET, 'GET', '/x', { params: { studio: s }, cookie: operator });
    expect((seenByOperator.json!.deliveries as { id: string }[]).map((d) => d.id)).not.toContain(draft.delivery.id);
    expect((await callRoute(delivery.GET, 'GET', '/x', { params: { studio: s, deliveryId: draft.delivery.id }, cookie: operator })).status).toBe(404);
    expect((await callRoute(download.GET, 'GET', '/x', { params: { studio: s, deliveryId: draft.delivery.id }, cookie: operator })).status).toBe(404);

    const seenByAdvisor = await callRoute(deliveries.GET, 'GET', '/x', { params: { studio: s }, cookie: advisor });
    const row = (seenByAdvisor.json!.deliveries as { id: string; approved: boolean }[]).find((d) => d.id === draft.delivery.id);
    expect(row?.approved).toBe(false);
  });
});
