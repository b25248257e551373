import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assertTestDatabase, closeDatabase } from '../../support/db';
import { makeUser, TEST_PASSWORD } from '../../support/factories';
import { verifyCredentials } from '@/lib/auth/credentials';
import { env } from '@/lib/env';

beforeAll(assertTestDatabase);
afterAll(closeDatabase);

const address = () => `198.51.100.${Math.floor(Math.random() * 250)}-${Date.now()}`; // RFC 5737 documentation range

describe('verifyCredentials', () => {
  it('should accept the right password and answer the same "invalid" for a wrong password and an unknown e-mail', async () => {
    const user = await makeUser();
    const ip = address();
    expect(await verifyCredentials({ email: user.email, password: TEST_PASSWORD }, ip)).toMatchObject({ ok: true, user: { id: user.id } });
    const wrong = await verifyCredentials({ email: user.email, password: 'wrong-password' }, ip);
    const unknown = await verifyCredentials({ email: `nobody-${Date.now()}@example.test`, password: 'wrong-password' }, ip);
    expect(wrong).toEqual({ ok: false, reason: 'invalid' });
    expect(unknown).toEqual(wrong);
  });

  it('should lock an account after the allowed failures, even with the right password, from any address', async () => {
    const user = await makeUser();
    for (let i = 0; i < env.SIGN_IN_MAX_FAILURES_PER_ACCOUNT; i++) {
      expect((await verifyCredentials({ email: user.email, password: `wrong-${i}` }, address())).ok).toBe(false);
    }
    expect(await verifyCredentials({ email: user.email, password: TEST_PASSWORD }, address())).toEqual({ ok: false, reason: 'throttled' });
  });

  it('should limit one address trying many accounts', async () => {
    const ip = address();
    for (let i = 0; i < env.SIGN_IN_MAX_FAILURES_PER_ADDRESS; i++) {
      await verifyCredentials({ email: `spray-${i}-${Date.now()}@example.test`, password: 'guess' }, ip);
    }
    const user = await makeUser();
    expect(await verifyCredentials({ email: user.email, password: TEST_PASSWORD }, ip)).toEqual({ ok: false, reason: 'throttled' });
    expect((await verifyCredentials({ email: user.email, password: TEST_PASSWORD }, address())).ok).toBe(true);
  });

  it('should not reveal anything for malformed input', async () => {
    expect(await verifyCredentials({ email: 'not-an-email', password: '' }, address())).toEqual({ ok: false, reason: 'invalid' });
    expect(await verifyCredentials(undefined, address())).toEqual({ ok: false, reason: 'invalid' });
  });
});
