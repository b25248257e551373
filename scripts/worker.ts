// `npm run worker`: one render worker process. Point DATABASE_URL and the S3_*
// variables at shared services to add workers on other machines.
import os from 'node:os';
import { env } from '@/lib/env';
import { runWorker } from '@/lib/renders/worker';

const name = env.SKYWELL_WORKER_NAME ?? `${os.hostname()}-${process.pid}`;

runWorker(name)
  .then(({ stop }) => {
    const shutdown = () => {
      console.log(`[${name}] stopping after the frame in hand`);
      stop().then(() => process.exit(0), () => process.exit(1));
    };
    process.on('SIGTERM', shutdown);
    process.on('SIGINT', shutdown);
  })
  .catch((error: unknown) => {
    console.error(`[${name}] could not start: ${error instanceof Error ? error.message : String(error)} (database ${new URL(env.DATABASE_URL).host})`);
    process.exit(1);
  });
