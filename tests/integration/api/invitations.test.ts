import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import bcrypt from 'bcryptjs';
import { assertTestDatabase, closeDatabase } from '../../support/db';
import { makeStudioWithCast, makeUser, sessionCookie } from '../../support/factories';
import { callRoute } from '../../support/route';
import { invitationLinkIn, waitForMessageTo } from '../../support/mailbox';
import * as invitations from '@/app/api/v1/studios/[studio]/invitations/route';
import * as accept from '@/app/api/v1/invitations/accept/route';
import * as emails from '@/app/api/v1/studios/[studio]/emails/route';
import { invitationState } from '@/lib/studio/invitations';
import { Invitation, Membership, User } from '@/models';

beforeAll(assertTestDatabase);
afterAll(closeDatabase);

const unique = () => `${Date.now()}-${Math.random().toString(16).slice(2, 8)}`;
const tokenOf = (link: string) => link.split('/invitations/')[1];

async function inviteThroughApi(role: string, email = `invitee-${unique()}@example.test`) {
  const world = await makeStudioWithCast();
  const cookie = await sessionCookie(world.cast.admin.user);
  const res = await callRoute(invitations.POST, 'POST', '/x', { params: { studio: world.studio.slug }, body: { email, role }, cookie });
  return { world, cookie, res, email };
}

describe('POST /api/v1/studios/:studio/invitations', () => {
  it('should send an e-mail through SMTP with a one-time link and record it', async () => {
    const { world, cookie, res, email } = await inviteThroughApi('advisor');
    expect(res.status).toBe(201);
    expect(res.json!.emailError).toBeNull();
    const message = await waitForMessageTo(email);
    expect(message.subject).toContain(world.studio.name);
    const link = invitationLinkIn(message.text);
    expect(await invitationState(tokenOf(link))).toMatchObject({ state: 'open', role: 'advisor', needsPassword: true });

    const log = await callRoute(emails.GET, 'GET', '/x', { params: { studio: world.studio.slug }, cookie });
    expect((log.json!.emails as { to: string; status: string }[]).find((e) => e.to === email)?.status).toBe('sent');
  });

  it('should refuse a person who is already a member with 409', async () => {
    const world = await makeStudioWithCast();
    const res = await callRoute(invitations.POST, 'POST', '/x', {
      params: { studio: world.studio.slug },
      body: { email: world.cast.producer.user.email, role: 'advisor' },
      cookie: await sessionCookie(world.cast.admin.user),
    });
    expect(res.status).toBe(409);
  });

  it('should answer 400 naming the field for a bad e-mail and create nothing', async () => {
    const world = await makeStudioWithCast();
    const res = await callRoute(invitations.POST, 'POST', '/x', { params: { studio: world.studio.slug }, body: { email: 'not-an-address', role: 'advisor' }, cookie: await sessionCookie(world.cast.admin.user) });
    expect(res.status).toBe(400);
    expect((res.json!.errors as { field: string }[])[0].field).toBe('email');
    expect(await Invitation.count({ where: { studioId: world.studio.id } })).toBe(0);
  });
});

describe('POST /api/v1/invitations/accept', () => {
  it('should create the account with the invited role, then refuse the same link again with 410', async () => {
    const { world, email } = await inviteThroughApi('operator');
    const token = tokenOf(invitationLinkIn((await waitForMessageTo(email)).text));
    const first = await callRoute(accept.POST, 'POST', '/x', { body: { token, name: 'New Operator', password: 'a-long-password-1' } });
    expect(first.status).toBe(200);
    const user = await User.findOne({ where: { email } });
    expect(await bcrypt.compare('a-long-password-1', user!.passwordHash!)).toBe(true);
    expect((await Membership.findOne({ where: { userId: user!.id, studioId: world.studio.id } }))!.role).toBe('operator');

    const again = await callRoute(accept.POST, 'POST', '/x', { body: { token, name: 'Someone Else', password: 'another-password-2' } });
    expect(again.status).toBe(410);
    const unchanged = await User.findOne({ where: { email } });
    expect(unchanged!.passwordHash).toBe(user!.passwordHash);
  });

  it('should refuse an expired link with 410 and change nothing', async () => {
    const { email } = await inviteThroughApi('producer');
    const token = tokenOf(invitationLinkIn((await waitForMessageTo(email)).text));
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email } });
    const res = await callRoute(accept.POST, 'POST', '/x', { body: { token, name: 'Late', password: 'a-long-password-1' } });
    expect(res.status).toBe(410);
    expect(res.json!.detail).toMatch(/expired/);
    expect(await User.findOne({ where: { email } })).toBeNull();
    expect(await invitationState(token)).toEqual({ state: 'expired' });
  });

  it('should refuse a short password with 400 and leave the link usable', async () => {
    const { email } = await inviteThroughApi('producer');
    const token = tokenOf(invitationLinkIn((await waitForMessageTo(email)).text));
    const res = await callRoute(accept.POST, 'POST', '/x', { body: { token, name: 'Shorty', password: 'short' } });
    expect(res.status).toBe(400);
    expect((await invitationState(token)).state).toBe('open');
  });

  it('should add an existing account to the studio without touching its password', async () => {
    const existing = await makeUser();
    const { world } = await inviteThroughApi('advisor', existing.email);
    const token = tokenOf(invitationLinkIn((await waitForMessageTo(existing.email)).text));
    expect(await invitationState(token)).toMatchObject({ needsPassword: false });
    const res = await callRoute(accept.POST, 'POST', '/x', { body: { token } });
    expect(res.status).toBe(200);
    expect((await User.findByPk(existing.id))!.passwordHash).toBe(existing.passwordHash);
    expect((await Membership.findOne({ where: { userId: existing.id, studioId: world.studio.id } }))!.role).toBe('advisor');
  });
});
