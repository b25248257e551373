// Render-farm bench (issue 6): frames per minute of a 1024x1024 dome-master
// sequence with one worker and with two (one render thread each, so the two
// share this machine's cores), and the queue's overhead per frame: wall time
// per frame against the render time the workers record. Needs the services
// `npm run bench` starts (a separate bench database and object store).
import { spawn } from 'node:child_process';
import { createScene, createShow } from '@/lib/scenes/service';
import { requestRender } from '@/lib/renders/service';
import { stopQueue } from '@/lib/queue/boss';
import { ensureBucket } from '@/lib/storage/s3';
import { DEMO_SCENES } from '@/lib/demo/scenes';
import { Frame, RenderJob, Studio, User, sequelize } from '@/models';

const FRAMES = 8;
const SIDE = 1024;

function startWorker(name: string) {
  return spawn(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/worker.ts'], {
    env: { ...process.env, SKYWELL_WORKER_NAME: name, RENDER_THREADS: '1' },
    stdio: 'ignore',
  });
}

async function runOnce(workers: number, studioId: string, userId: string, sceneId: string) {
  const procs = Array.from({ length: workers }, (_, i) => startWorker(`bench-${workers}-${i}`));
  // Let the workers load the engine and the sky data before the clock starts.
  await new Promise((r) => setTimeout(r, 8000));
  const started = performance.now();
  const job = await requestRender(studioId, userId, { sceneId, revision: 1, kind: 'sequence', frames: { start: 0, end: FRAMES - 1 }, settings: { width: SIDE, height: SIDE, format: 'png8', supersampling: 1 } });
  for (;;) {
    const current = await RenderJob.findByPk(job.id);
    if (current!.status === 'done' || current!.status === 'failed') break;
    await new Promise((r) => setTimeout(r, 100));
  }
  const wallS = (performance.now() - started) / 1000;
  const frames = await Frame.findAll({ where: { renderJobId: job.id } });
  const renderS = frames.reduce((s, f) => s + f.renderMs, 0) / 1000;
  for (const p of procs) p.kill('SIGTERM');
  await new Promise((r) => setTimeout(r, 1500));
  return { wallS, framesPerMinute: (frames.length / wallS) * 60, overhead: (wallS * workers - renderS) / renderS };
}

async function main() {
  await ensureBucket();
  const studio = await Studio.findOne({ where: { slug: 'saltmarsh-dome' } });
  const producer = await User.findOne({ where: { email: 'producer@saltmarsh-dome.test' } });
  if (!studio || !producer) throw new Error('the bench database has no demo studio: run through npm run bench');
  const show = await createShow(studio.id, producer.id, `Bench ${new Date().toISOString()}`);
  const approach = DEMO_SCENES[0];
  const { scene } = await createScene(studio.id, producer.id, show.id, 'Bench approach', approach.spec);

  const one = await runOnce(1, studio.id, producer.id, scene.id);
  const two = await runOnce(2, studio.id, producer.id, scene.id);
  console.log(`farm: ${FRAMES} frames of a ${SIDE}x${SIDE} dome master (demo "${approach.name}"), one render thread per worker`);
  console.log(`farm: 1 worker  ${one.framesPerMinute.toFixed(1)} frames/min (wall ${one.wallS.toFixed(1)} s)`);
  console.log(`farm: 2 workers ${two.framesPerMinute.toFixed(1)} frames/min (wall ${two.wallS.toFixed(1)} s)`);
  console.log(`farm: scaling 2/1 workers ${(two.framesPerMinute / one.framesPerMinute).toFixed(2)}x (target >= 1.8)`);
  console.log(`farm: queue overhead per frame ${(one.overhead * 100).toFixed(1)}% with 1 worker, ${(two.overhead * 100).toFixed(1)}% with 2 (target < 5%)`);
  await stopQueue();
  await sequelize.close();
}

main().catch(async (error: unknown) => {
  console.error(`farm bench failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
