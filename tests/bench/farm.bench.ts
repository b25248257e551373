// Render-farm bench (issue 6): frames per minute of a 1024x1024 dome-master
// sequence with one worker and with two (one render thread each, so two
// workers share this machine's two cores), and the queue's overhead per frame.
// Needs the services `npm run bench` starts (its own database and object store).
//
// What is timed, from the frames the workers record (created_at is when a
// frame's row lands, after its object is stored; render_ms is the render alone):
// - throughput in the steady state: frames stored after every worker has
//   stored its first one (that frame carries loading the sky data and warming
//   the JIT), over the time from then to the last frame stored; the clock covers
//   the queue hand-offs but not start-up or the photosensitivity pass;
// - overhead: per worker after its first frame, the time from its next render
//   start to its last frame stored, minus the render time it recorded, over
//   that render time (queue fetch and completion, database reads, SHA-256, S3
//   put, readouts; the worker stores a frame while the next one renders).
import { spawn, type ChildProcess } from 'node:child_process';
import os from 'node:os';
import { createScene, createShow } from '@/lib/scenes/service';
import { requestRender } from '@/lib/renders/service';
import { stopQueue } from '@/lib/queue/boss';
import { ensureBucket } from '@/lib/storage/s3';
import { DEMO_SCENES } from '@/lib/demo/scenes';
import { Frame, RenderJob, Studio, User, sequelize } from '@/models';

const FRAMES = 30;
const SIDE = 1024;
const ROUNDS = 2;

/** Starts a worker process and resolves once it listens for frames. */
function startWorker(name: string): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--conditions=react-server', '--import', 'tsx', 'scripts/worker.ts'], {
    env: { ...process.env, SKYWELL_WORKER_NAME: name, RENDER_THREADS: '1' },
    stdio: ['ignore', 'pipe', 'ignore'],
  });
  return new Promise((resolve, reject) => {
    child.once('exit', (code) => reject(new Error(`worker ${name} exited (${code}) before it was ready`)));
    child.stdout!.on('data', (d: Buffer) => {
      if (d.toString().includes('waiting for frames')) resolve(child);
    });
  });
}

interface Run {
  framesPerMinute: number;
  /** frames stored after every worker's first frame */
  steadyFrames: number;
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
  const procs = await Promise.all(Array.from({ length: workers }, (_, i) => startWorker(`bench-${workers}-${i}`)));
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
  const storedAt = (f: Frame) => f.createdAt.getTime();
  const byWorker = new Map<string, Frame[]>();
  for (const f of frames) byWorker.set(f.worker ?? '?', [...(byWorker.get(f.worker ?? '?') ?? []), f]);
  // Steady state: from the moment every worker has stored its first frame (which carries loading the sky
  // data and warming the JIT) to the last frame stored, counting the frames stored in between.
  const windowStart = Math.max(...[...byWorker.values()].map((list) => Math.min(...list.map(storedAt))));
  const windowEnd = Math.max(...frames.map(storedAt));
  const inWindow = frames.filter((f) => storedAt(f) > windowStart).length;
  let busyMs = 0;
  let renderMs = 0;
  for (const list of byWorker.values()) {
    // per worker, after its first frame: wall time from the next render's start to its last frame stored
    const rest = list.filter((f) => storedAt(f) > Math.min(...list.map(storedAt)));
    if (!rest.length) continue;
    busyMs += Math.max(...rest.map(storedAt)) - Math.min(...rest.map(startOf));
    renderMs += rest.reduce((sum, f) => sum + f.renderMs, 0);
  }
  const spanMs = windowEnd - windowStart;
  await new Promise((r) => setTimeout(r, 2000));
  return {
    framesPerMinute: (inWindow / spanMs) * 60_000,
    steadyFrames: inWindow,
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

  // alternate 1 and 2 workers twice, so a change in the machine's load hits both alike
  const ones: Run[] = [];
  const twos: Run[] = [];
  for (let round = 0; round < ROUNDS; round++) {
    ones.push(await runOnce(1, studio.id, producer.id, scene.id));
    twos.push(await runOnce(2, studio.id, producer.id, scene.id));
  }
  const line = (n: number, r: Run) =>
    `farm: ${n} worker${n > 1 ? 's' : ' '} ${r.framesPerMinute.toFixed(1)} frames/min (${r.steadyFrames} steady-state frames in ${r.spanS.toFixed(1)} s; render median ${r.renderMsMedian} ms/frame; frames per worker ${Object.values(r.perWorker).join(' + ')})`;
  console.log(`farm: ${FRAMES} frames of a ${SIDE}x${SIDE} dome master (demo "${approach.name}"), PNG8, one render thread per worker, ${os.availableParallelism()} cores, ${ROUNDS} alternating rounds`);
  for (let round = 0; round < ROUNDS; round++) {
    console.log(line(1, ones[round]));
    console.log(line(2, twos[round]));
  }
  const ratios = ones.map((one, i) => twos[i].framesPerMinute / one.framesPerMinute);
  const renderSlowdown = ones.map((one, i) => twos[i].renderMsMedian / one.renderMsMedian);
  console.log(`farm: scaling 2/1 workers per round ${ratios.map((r) => r.toFixed(2) + 'x').join(', ')} (target >= 1.8); each frame's render alone took ${renderSlowdown.map((r) => r.toFixed(2) + 'x').join(', ')} as long with two workers running`);
  const overhead = (runs: Run[]) => runs.map((r) => (r.overhead * 100).toFixed(1) + '%').join(', ');
  console.log(`farm: queue overhead per frame ${overhead(ones)} with 1 worker, ${overhead(twos)} with 2 (target < 5% of render time)`);
  await stopQueue();
  await sequelize.close();
}

main().catch(async (error: unknown) => {
  console.error(`farm bench failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
