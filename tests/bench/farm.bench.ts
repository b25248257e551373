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
import { machineBusyMs, median, processesWhere, processStat } from './support/process-stats';
import { createScene, createShow } from '@/lib/scenes/service';
import { requestRender } from '@/lib/renders/service';
import { stopQueue } from '@/lib/queue/boss';
import { ensureBucket } from '@/lib/storage/s3';
import { DEMO_SCENES } from '@/lib/demo/scenes';
import { Delivery, Frame, RenderJob, Studio, User, sequelize } from '@/models';

const FRAMES = 30;
const SIDE = 1024;
// This machine's speed drifts by a quarter from minute to minute, so the runs alternate in pairs, ABBA
// (1 then 2 workers, then 2 then 1), and the scaling reported is the median of the pairs' ratios.
const ROUNDS = 4;

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

/** CPU milliseconds used so far by the database (postgres processes, ended backends included) and the S3 fake. */
function servicesCpuMs(): { databaseMs: number; objectStoreMs: number } {
  const total = (pids: number[], reaped: boolean) =>
    pids.reduce((sum, pid) => {
      const stat = processStat(pid);
      return sum + (stat ? stat.cpuMs + (reaped ? stat.reapedMs : 0) : 0);
    }, 0);
  return { databaseMs: total(processesWhere((c) => c.startsWith('postgres')), true), objectStoreMs: total(processesWhere((c) => c.includes('s3rver')), false) };
}

/** A reading of the CPU counters at one moment. */
interface CpuSample {
  at: number;
  machineMs: number;
  workersMs: number;
  databaseMs: number;
  objectStoreMs: number;
  benchMs: number;
}

/** Linear interpolation of a counter between samples at time t (ms since the epoch). */
function counterAt(samples: CpuSample[], t: number, pick: (s: CpuSample) => number): number {
  const i = samples.findIndex((s) => s.at >= t);
  if (i <= 0) return pick(samples[Math.max(0, i)]);
  const a = samples[i - 1];
  const b = samples[i];
  return pick(a) + ((pick(b) - pick(a)) * (t - a.at)) / Math.max(1, b.at - a.at);
}

interface Run {
  framesPerMinute: number;
  /** frames stored after every worker's first frame */
  steadyFrames: number;
  spanS: number;
  overhead: number;
  renderMsMedian: number;
  perWorker: Record<string, number>;
  /** CPU ms per steady-state frame: the whole machine, and the worker processes alone */
  machineCpuMsPerFrame: number;
  workersCpuMsPerFrame: number;
  databaseCpuMsPerFrame: number;
  objectStoreCpuMsPerFrame: number;
  benchCpuMsPerFrame: number;
  renderMsMean: number;
  /** seconds from the render's completion to its delivery: the photosensitivity pass over all frames */
  deliveryAfterS: number;
}

async function runOnce(workers: number, studioId: string, userId: string, sceneId: string): Promise<Run> {
  const procs = await Promise.all(Array.from({ length: workers }, (_, i) => startWorker(`bench-${workers}-${i}`)));
  const job = await requestRender(studioId, userId, { sceneId, revision: 1, kind: 'sequence', frames: { start: 0, end: FRAMES - 1 }, settings: { width: SIDE, height: SIDE, format: 'png8', supersampling: 1 } });
  const samples: CpuSample[] = [];
  const sample = () => samples.push({ at: Date.now(), machineMs: machineBusyMs(), workersMs: procs.reduce((sum, p) => sum + (processStat(p.pid)?.cpuMs ?? 0), 0), ...servicesCpuMs(), benchMs: processStat(process.pid)?.cpuMs ?? 0 });
  for (;;) {
    sample();
    const current = await RenderJob.findByPk(job.id, { attributes: ['status', 'framesDone'] });
    if (current!.status === 'failed' || current!.status === 'cancelled') throw new Error(`the bench render ended ${current!.status}`);
    if (current!.framesDone >= FRAMES) break;
    // a slow poll: this process shares the two cores with the workers it measures
    await new Promise((r) => setTimeout(r, 1000));
  }
  sample();
  // a worker finishes what it holds before it exits (the last frame's store, the photosensitivity pass), so the
  // next run starts on a quiet machine
  const exited = procs.map((p) => (p.exitCode !== null ? Promise.resolve() : new Promise((resolve) => p.once('exit', resolve))));
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
  const cpuIn = (pick: (s: CpuSample) => number) => (counterAt(samples, windowEnd, pick) - counterAt(samples, windowStart, pick)) / inWindow;
  const steady = frames.filter((f) => storedAt(f) > windowStart);
  await Promise.all(exited);
  const [finished, delivery] = await Promise.all([RenderJob.findByPk(job.id, { attributes: ['finishedAt'] }), Delivery.findOne({ where: { renderJobId: job.id }, attributes: ['createdAt'] })]);
  if (!finished?.finishedAt || !delivery) throw new Error('the bench render has no delivery after its workers stopped');
  return {
    deliveryAfterS: (delivery.createdAt.getTime() - finished.finishedAt.getTime()) / 1000,
    framesPerMinute: (inWindow / spanMs) * 60_000,
    steadyFrames: inWindow,
    spanS: spanMs / 1000,
    overhead: (busyMs - renderMs) / renderMs,
    renderMsMedian: median(frames.map((f) => f.renderMs)),
    perWorker: Object.fromEntries([...byWorker].map(([name, list]) => [name, list.length])),
    machineCpuMsPerFrame: cpuIn((c) => c.machineMs),
    workersCpuMsPerFrame: cpuIn((c) => c.workersMs),
    databaseCpuMsPerFrame: cpuIn((c) => c.databaseMs),
    objectStoreCpuMsPerFrame: cpuIn((c) => c.objectStoreMs),
    benchCpuMsPerFrame: cpuIn((c) => c.benchMs),
    renderMsMean: steady.reduce((sum, f) => sum + f.renderMs, 0) / steady.length,
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

  // alternate 1 and 2 workers (ABBA), so a change in the machine's speed hits both alike
  const ones: Run[] = [];
  const twos: Run[] = [];
  for (let round = 0; round < ROUNDS; round++) {
    for (const workers of round % 2 === 0 ? [1, 2] : [2, 1]) (workers === 1 ? ones : twos).push(await runOnce(workers, studio.id, producer.id, scene.id));
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
  console.log(`farm: scaling 2/1 workers per round ${ratios.map((r) => r.toFixed(2) + 'x').join(', ')}, median ${median(ratios).toFixed(2)}x (target >= 1.8); each frame's render alone took ${renderSlowdown.map((r) => r.toFixed(2) + 'x').join(', ')} as long with two workers running`);
  const cpu = (r: Run) =>
    `${r.machineCpuMsPerFrame.toFixed(0)} ms (workers ${r.workersCpuMsPerFrame.toFixed(0)} with render wall ${r.renderMsMean.toFixed(0)}, PostgreSQL ${r.databaseCpuMsPerFrame.toFixed(0)}, S3 fake ${r.objectStoreCpuMsPerFrame.toFixed(0)}, this bench ${r.benchCpuMsPerFrame.toFixed(0)})`;
  console.log(`farm: CPU time per steady-state frame, whole machine: 1 worker ${ones.map(cpu).join(', ')}; 2 workers ${twos.map(cpu).join(', ')}`);
  console.log(`farm: delivery ready after the last frame (photosensitivity pass over ${FRAMES} frames, one worker) ${[...ones, ...twos].map((r) => r.deliveryAfterS.toFixed(1) + ' s').join(', ')}`);
  const overhead = (runs: Run[]) => runs.map((r) => (r.overhead * 100).toFixed(1) + '%').join(', ');
  console.log(`farm: queue overhead per frame ${overhead(ones)} with 1 worker, ${overhead(twos)} with 2 (target < 5% of render time)`);
  await stopQueue();
  await sequelize.close();
}

main().catch(async (error: unknown) => {
  console.error(`farm bench failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
