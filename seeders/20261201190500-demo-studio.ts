import bcrypt from 'bcryptjs';
import { env } from '@/lib/env';
import { DEMO_ACCOUNTS, DEMO_STUDIO } from '@/lib/demo/accounts';
import { Membership, Studio, User, sequelize } from '@/models';

// The demo studio and one account per role. Idempotent: existing rows (and any
// password a person has since changed) are left as they are.
export async function up(): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const [studio] = await Studio.findOrCreate({ where: { slug: DEMO_STUDIO.slug }, defaults: { ...DEMO_STUDIO }, transaction });
    const passwordHash = await bcrypt.hash(env.SKYWELL_DEMO_PASSWORD, 10);
    for (const account of DEMO_ACCOUNTS) {
      const [user] = await User.findOrCreate({
        where: { email: account.email },
        defaults: { email: account.email, name: account.name, passwordHash },
        transaction,
      });
      await Membership.findOrCreate({
        where: { userId: user.id, studioId: studio.id },
        defaults: { userId: user.id, studioId: studio.id, role: account.role },
        transaction,
      });
    }
  });
}
