// Render-farm bench (issue 6): frames per minute of a 1024x1024 dome-master
// sequence with one worker and with two (one render thread each, so two
// workers share this machine's two cores), and the queue's overhead per frame.
// Needs the services `npm run bench` starts (its own database and object store).
//
// What is timed, from the frames the workers record (created_at is when a
// frame's row lands, after its object is stored; render_ms is the render alone):
// - throughput: frames / (last frame stored - first frame's render start), so
//   the clock covers the queue hand-offs between frames but not the workers'
//   start-up, the first poll or the photosensitivity pass after the last frame;
// - overhead: per worker, the time between its first render start and its last
//   frame stored, minus the render time it recorded, over that render time
//   (queue fetch and completion, database reads, SHA-256, S3 put, readouts).
import { spawn } from 'node:child_process';
import { createScene, createShow } from '@/lib/scenes/service';
import { requestRender } from '@/lib/renders/service';
import { stopQueue } from '@/lib/queue/boss';
import { ensureBucket } from '@/lib/storage/s3';
import { DEMO_SCENES } from '@/lib/demo/scenes';
import { Frame, RenderJob, Studio, User, sequelize } from '@/models';

const FRAMES = 24;
const SIDE = 1024;

function startWorker(name: string) {
  return spawn(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/worker.ts'], {
    env: { ...process.env, SKYWELL_WORKER_NAME: name, RENDER_THREADS: '1' },
    stdio: 'ignore',
  });
}

interface Run {
  framesPerMinute: number;
  spanS: number;
  overhead: number;
  renderMsMedian: number;
  perWorker: Record<string, number>;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
}

async function runOnce(workers: number, studioId: string, userId: string, sceneId: string): Promise<Run> {
  const procs = Array.from({ length: workers }, (_, i) => startWorker(`bench-${workers}-${i}`));
  // Let the workers load the engine and the sky data first.
  await new Promise((r) => setTimeout(r, 8000));
  const job = await requestRender(studioId, userId, { sceneId, revision: 1, kind: 'sequence', frames: { start: 0, end: FRAMES - 1 }, settings: { width: SIDE, height: SIDE, format: 'png8', supersampling: 1 } });
  for (;;) {
    const current = await RenderJob.findByPk(job.id, { attributes: ['status', 'framesDone'] });
    if (current!.status === 'failed' || current!.status === 'cancelled') throw new Error(`the bench render ended ${current!.status}`);
    if (current!.framesDone >= FRAMES) break;
    await new Promise((r) => setTimeout(r, 250));
  }
  for (const p of procs) p.kill('SIGTERM');
  const frames = await Frame.findAll({ where: { renderJobId: job.id }, attributes: ['worker', 'renderMs', 'createdAt'] });
  if (frames.length !== FRAMES) throw new Error(`expected ${FRAMES} frames, found ${frames.length}`);
  const startOf = (f: Frame) => f.createdAt.getTime() - f.renderMs;
  const spanMs = Math.max(...frames.map((f) => f.createdAt.getTime())) - Math.min(...frames.map(startOf));
  const byWorker = new Map<string, Frame[]>();
  for (const f of frames) byWorker.set(f.worker ?? '?', [...(byWorker.get(f.worker ?? '?') ?? []), f]);
  let busyMs = 0;
  let renderMs = 0;
  for (const list of byWorker.values()) {
    busyMs += Math.max(...list.map((f) => f.createdAt.getTime())) - Math.min(...list.map(startOf));
    renderMs += list.reduce((s, f) => s + f.renderMs, 0);
  }
  await new Promise((r) => setTimeout(r, 2000));
  return {
    framesPerMinute: (FRAMES / spanMs) * 60_000,
    spanS: spanMs / 1000,
    overhead: (busyMs - renderMs) / renderMs,
    renderMsMedian: median(frames.map((f) => f.renderMs)),
    perWorker: Object.fromEntries([...byWorker].map(([name, list]) => [name, list.length])),
  };
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
  const line = (n: number, r: Run) =>
    `farm: ${n} worker${n > 1 ? 's' : ' '} ${r.framesPerMinute.toFixed(1)} frames/min (${FRAMES} frames in ${r.spanS.toFixed(1)} s; render median ${r.renderMsMedian} ms/frame; frames per worker ${Object.values(r.perWorker).join(' + ')})`;
  console.log(`farm: ${FRAMES} frames of a ${SIDE}x${SIDE} dome master (demo "${approach.name}"), PNG8, one render thread per worker, ${(await import('node:os')).availableParallelism()} cores`);
  console.log(line(1, one));
  console.log(line(2, two));
  console.log(`farm: scaling 2/1 workers ${(two.framesPerMinute / one.framesPerMinute).toFixed(2)}x (target >= 1.8)`);
  console.log(`farm: queue overhead per frame ${(one.overhead * 100).toFixed(1)}% with 1 worker, ${(two.overhead * 100).toFixed(1)}% with 2 (target < 5% of render time)`);
  await stopQueue();
  await sequelize.close();
}

main().catch(async (error: unknown) => {
  console.error(`farm bench failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
