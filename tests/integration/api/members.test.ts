import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assertTestDatabase, closeDatabase } from '../../support/db';
import { makeMember, makeStudio, makeStudioWithCast, sessionCookie } from '../../support/factories';
import { callRoute } from '../../support/route';
import * as member from '@/app/api/v1/studios/[studio]/members/[memberId]/route';
import * as members from '@/app/api/v1/studios/[studio]/members/route';
import { AuditEvent, Membership } from '@/models';

beforeAll(assertTestDatabase);
afterAll(closeDatabase);

describe('PATCH /api/v1/studios/:studio/members/:memberId', () => {
  it('should change a role and record it in the audit log', async () => {
    const { studio, cast } = await makeStudioWithCast();
    const target = await makeMember(studio, 'producer');
    const res = await callRoute(member.PATCH, 'PATCH', '/x', { params: { studio: studio.slug, memberId: target.membership.id }, body: { role: 'advisor' }, cookie: await sessionCookie(cast.admin.user) });
    expect(res.status).toBe(200);
    expect((res.json!.member as { role: string }).role).toBe('advisor');
    const event = await AuditEvent.findOne({ where: { studioId: studio.id, action: 'member.role_changed', targetId: target.membership.id } });
    expect(event?.data).toEqual({ from: 'producer', to: 'advisor' });
  });

  it('should refuse to demote the last admin with 409 and change nothing', async () => {
    const studio = await makeStudio();
    const { user, membership } = await makeMember(studio, 'admin');
    const res = await callRoute(member.PATCH, 'PATCH', '/x', { params: { studio: studio.slug, memberId: membership.id }, body: { role: 'producer' }, cookie: await sessionCookie(user) });
    expect(res.status).toBe(409);
    expect(res.json!.detail).toMatch(/last admin/);
    expect((await Membership.findByPk(membership.id))!.role).toBe('admin');
  });

  it('should answer 400 naming the field for an unknown role, unknown fields, wrong types and malformed JSON', async () => {
    const { studio, cast } = await makeStudioWithCast();
    const target = await makeMember(studio, 'producer');
    const base = { params: { studio: studio.slug, memberId: target.membership.id }, cookie: await sessionCookie(cast.admin.user) };
    const cases = [
      { options: { body: { role: 'director' } }, expectDetail: /role must be one of/ },
      { options: { body: { role: 'advisor', colour: 'red' } }, expectDetail: /Unknown field 'colour'/ },
      { options: { body: { role: 7 } }, expectDetail: /role/ },
      { options: { rawBody: '{"role": ', headers: { 'content-type': 'application/json' } }, expectDetail: /not valid JSON/ },
      { options: { rawBody: 'role=advisor', headers: { 'content-type': 'application/x-www-form-urlencoded' } }, expectDetail: /Content-Type: application\/json/ },
    ];
    for (const c of cases) {
      const res = await callRoute(member.PATCH, 'PATCH', '/x', { ...base, ...c.options });
      expect(res.status).toBe(400);
      expect(res.contentType).toBe('application/problem+json');
      expect(String(res.json!.detail)).toMatch(c.expectDetail);
    }
    expect((await Membership.findByPk(target.membership.id))!.role).toBe('producer');
  });

  it('should answer 413 for an oversize body and write nothing', async () => {
    const { studio, cast } = await makeStudioWithCast();
    const target = await makeMember(studio, 'producer');
    const res = await callRoute(member.PATCH, 'PATCH', '/x', {
      params: { studio: studio.slug, memberId: target.membership.id },
      body: { role: 'advisor', padding: 'x'.repeat(70 * 1024) },
      cookie: await sessionCookie(cast.admin.user),
    });
    expect(res.status).toBe(413);
    expect((await Membership.findByPk(target.membership.id))!.role).toBe('producer');
  });

  it('should answer 404 for a member id from another studio', async () => {
    const { studio, cast, foreigner } = await makeStudioWithCast();
    const res = await callRoute(member.PATCH, 'PATCH', '/x', { params: { studio: studio.slug, memberId: foreigner.membership.id }, body: { role: 'advisor' }, cookie: await sessionCookie(cast.admin.user) });
    expect(res.status).toBe(404);
    expect((await Membership.findByPk(foreigner.membership.id))!.role).toBe('admin');
  });

  it('should take effect at once: a demoted admin is refused on the next request', async () => {
    const { studio, cast } = await makeStudioWithCast();
    const second = await makeMember(studio, 'admin');
    const cookie = await sessionCookie(second.user);
    await callRoute(member.PATCH, 'PATCH', '/x', { params: { studio: studio.slug, memberId: second.membership.id }, body: { role: 'operator' }, cookie: await sessionCookie(cast.admin.user) });
    const res = await callRoute(members.GET, 'GET', '/x', { params: { studio: studio.slug }, cookie });
    expect(res.status).toBe(403);
  });
});

describe('DELETE /api/v1/studios/:studio/members/:memberId', () => {
  it('should remove a member, who then gets 404 for the studio', async () => {
    const { studio, cast } = await makeStudioWithCast();
    const target = await makeMember(studio, 'admin');
    const res = await callRoute(member.DELETE, 'DELETE', '/x', { params: { studio: studio.slug, memberId: target.membership.id }, cookie: await sessionCookie(cast.admin.user) });
    expect(res.status).toBe(204);
    const after = await callRoute(members.GET, 'GET', '/x', { params: { studio: studio.slug }, cookie: await sessionCookie(target.user) });
    expect(after.status).toBe(404);
  });

  it('should never remove the last admin', async () => {
    const studio = await makeStudio();
    const { user, membership } = await makeMember(studio, 'admin');
    const res = await callRoute(member.DELETE, 'DELETE', '/x', { params: { studio: studio.slug, memberId: membership.id }, cookie: await sessionCookie(user) });
    expect(res.status).toBe(409);
    expect(await Membership.findByPk(membership.id)).not.toBeNull();
  });

  it('should keep one admin when two admins remove each other at the same time', async () => {
    const studio = await makeStudio();
    const a = await makeMember(studio, 'admin');
    const b = await makeMember(studio, 'admin');
    const [ra, rb] = await Promise.all([
      callRoute(member.DELETE, 'DELETE', '/x', { params: { studio: studio.slug, memberId: b.membership.id }, cookie: await sessionCookie(a.user) }),
      callRoute(member.DELETE, 'DELETE', '/x', { params: { studio: studio.slug, memberId: a.membership.id }, cookie: await sessionCookie(b.user) }),
    ]);
    expect([ra.status, rb.status].sort()).toContain(204);
    expect(await Membership.count({ where: { studioId: studio.id, role: 'admin' } })).toBe(1);
  });
});
