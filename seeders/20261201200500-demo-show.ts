import { DEMO_SCENES, DEMO_SHOW_NAME } from '@/lib/demo/scenes';
import { DEMO_ACCOUNTS, DEMO_STUDIO } from '@/lib/demo/accounts';
import { contentHash } from '@/lib/scenes/hash';
import { sceneSpecSchema } from '@/lib/scenes/schema';
import { Scene, SceneRevision, Show, Studio, User, sequelize } from '@/models';

// The demo show "The Long Fall" with its four scenes, each a real, renderable
// first revision. Idempotent: a show or scene that exists is left alone.
export async function up(): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const studio = await Studio.findOne({ where: { slug: DEMO_STUDIO.slug }, transaction });
    if (!studio) throw new Error('the demo studio seeder must run first');
    const producer = await User.findOne({ where: { email: DEMO_ACCOUNTS.find((a) => a.role === 'producer')!.email }, transaction });
    const [show] = await Show.findOrCreate({
      where: { studioId: studio.id, name: DEMO_SHOW_NAME },
      defaults: { studioId: studio.id, name: DEMO_SHOW_NAME, archivedAt: null, createdById: producer?.id ?? null },
      transaction,
    });
    for (const [position, demo] of DEMO_SCENES.entries()) {
      if (await Scene.findOne({ where: { showId: show.id, slug: demo.slug }, transaction })) continue;
      const spec = sceneSpecSchema.parse(demo.spec);
      const scene = await Scene.create(
        { studioId: studio.id, showId: show.id, name: demo.name, slug: demo.slug, position, archivedAt: null, latestRevisionNumber: 1, createdById: producer?.id ?? null },
        { transaction },
      );
      await SceneRevision.create(
        { studioId: studio.id, sceneId: scene.id, number: 1, basedOnNumber: null, spec, contentHash: contentHash(spec), message: 'Demo storyboard', authorId: producer?.id ?? null },
        { transaction },
      );
    }
  });
}
