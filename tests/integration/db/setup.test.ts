import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { assertTestDatabase, closeDatabase } from '../../support/db';
import { makeUser } from '../../support/factories';
import { migrate, seed } from '@/lib/db/migrator';
import { DEMO_ACCOUNTS, DEMO_STUDIO } from '@/lib/demo/accounts';
import { Membership, Studio, User } from '@/models';

beforeAll(assertTestDatabase);
afterAll(closeDatabase);

describe('start-up set-up (migrate + seed), as a second npm start runs it', () => {
  it('should keep every existing row and change no password when run again', async () => {
    await migrate();
    await seed();
    const extra = await makeUser({ name: 'Made between two starts' });
    const admin = await User.findOne({ where: { email: DEMO_ACCOUNTS[0].email } });
    const before = { users: await User.count(), memberships: await Membership.count(), studios: await Studio.count(), hash: admin!.passwordHash };

    expect(await migrate()).toEqual([]);
    await seed();

    expect(await User.findByPk(extra.id)).not.toBeNull();
    expect({ users: await User.count(), memberships: await Membership.count(), studios: await Studio.count(), hash: (await User.findByPk(admin!.id))!.passwordHash }).toEqual(before);
  });

  it('should have seeded the demo studio with one account per role', async () => {
    const studio = await Studio.findOne({ where: { slug: DEMO_STUDIO.slug } });
    expect(studio?.name).toBe('Saltmarsh Dome');
    for (const account of DEMO_ACCOUNTS) {
      const user = await User.findOne({ where: { email: account.email } });
      const membership = await Membership.findOne({ where: { studioId: studio!.id, userId: user!.id } });
      expect(membership?.role, account.email).toBe(account.role);
    }
    expect(DEMO_ACCOUNTS.map((a) => a.role).sort()).toEqual(['admin', 'advisor', 'operator', 'producer']);
  });
});
