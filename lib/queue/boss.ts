import 'server-only';
import PgBoss from 'pg-boss';
import { env } from '@/lib/env';

/** The queue of per-frame render work, on the project's PostgreSQL (pg-boss 10). */
export const RENDER_FRAME_QUEUE = 'render-frame';

export type RenderFrameJob = { renderJobId: string; index: number };

// Kept on globalThis so Next's dev reloads do not start a second pg-boss.
const holder = globalThis as unknown as { skywellQueue?: Promise<PgBoss> };

/** One started pg-boss per process; creates its schema and the queue on first use. */
export function queue(): Promise<PgBoss> {
  holder.skywellQueue ??= (async () => {
    // Maintenance finds frames whose worker died (expired) and puts them back for another worker.
    const boss = new PgBoss({ connectionString: env.DATABASE_URL, schema: 'pgboss', maintenanceIntervalSeconds: env.QUEUE_MAINTENANCE_SECONDS });
    boss.on('error', (error) => console.error('[queue]', error.message));
    await boss.start();
    await boss.createQueue(RENDER_FRAME_QUEUE, { name: RENDER_FRAME_QUEUE, retryLimit: 3, retryDelay: 2, expireInSeconds: env.RENDER_FRAME_TIMEOUT_SECONDS });
    return boss;
  })();
  return holder.skywellQueue;
}

export async function stopQueue(): Promise<void> {
  if (!holder.skywellQueue) return;
  const boss = await holder.skywellQueue;
  holder.skywellQueue = undefined;
  await boss.stop({ graceful: true, wait: true });
}
