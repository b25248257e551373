/**
 * Render benchmark (issue 4), run with `npx tsx tests/bench/render.bench.ts`.
 * Prints, measured side by side in one run on the same sky and projection:
 * 1. lensed frame time / plain sky remap (lensing off), 1024 x 1024 dome master, target <= 1.5
 * 2. brute force (every pixel's geodesic integrated with odex, then shaded like the lensed render;
 *    timed on a grid sample of the frame's pixels and extrapolated) / lensed, target >= 300
 * 3. 2-thread speed-up over 1 thread on warm pools, same frame, same code path, target >= 1.8
 * 4. a 4096 x 4096 dome master with stars and Milky Way: seconds (target < 10), peak RSS
 *    (target < 1536 MiB), pixels per second per core
 * Worker start-up (tsx loading) is excluded from every timing: pools are started and awaited first.
 * Exits 0; the targets are reported, not asserted.
 */
import os from 'node:os';
import { createRenderPool, renderFrameToImage, type RenderPool } from '../../lib/render/node/renderFrame';
import { loadSkyAssets } from '../../lib/render/node/assets';
import { parseFrameRequest } from '../../lib/render/schema';
import { prepareFrame } from '../../lib/render/frame';
import { BRUTE_FORCE_TOLERANCE, createBruteForceTracer, renderPixelsBruteForce } from '../../lib/render/bruteForce';

const base = {
  massSolar: 4.1e6,
  camera: { state: { kind: 'hover', radiusM: 12 }, holeDirection: { raDeg: 266.405, decDeg: -28.936 } },
  projection: { kind: 'dome', apertureDeg: 180 },
  width: 1024,
  height: 1024,
  output: { format: 'png8' },
};
const REPEATS = 7;
/** Brute force samples one pixel in every BRUTE_STRIDE x BRUTE_STRIDE block of the frame. */
const BRUTE_STRIDE = 32;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const load = () => os.loadavg().map((x) => x.toFixed(2)).join(' ');

async function timeFrame(req: object, pool: RenderPool): Promise<{ totalS: number; bandsS: number }> {
  const t = performance.now();
  const r = await renderFrameToImage(req, { pool });
  return { totalS: (performance.now() - t) / 1000, bandsS: r.timings.bandsS };
}

/** Median wall time of a frame, median of its bands stage, and the fastest frame, seconds. */
interface Timing {
  totalS: number;
  bandsS: number;
  bestS: number;
}

/**
 * Median wall times of two frame renders measured alternately (so a change in machine load hits both
 * alike): one warm-up frame each, then REPEATS pairs.
 */
async function alternate(
  a: { req: object; pool: RenderPool },
  b: { req: object; pool: RenderPool },
): Promise<[Timing, Timing]> {
  await timeFrame(a.req, a.pool);
  await timeFrame(b.req, b.pool);
  const ra: { totalS: number; bandsS: number }[] = [];
  const rb: { totalS: number; bandsS: number }[] = [];
  for (let i = 0; i < REPEATS; i++) {
    ra.push(await timeFrame(a.req, a.pool));
    rb.push(await timeFrame(b.req, b.pool));
  }
  const med = (rs: { totalS: number; bandsS: number }[]) => ({
    totalS: median(rs.map((r) => r.totalS)),
    bandsS: median(rs.map((r) => r.bandsS)),
    bestS: Math.min(...rs.map((r) => r.totalS)),
  });
  return [med(ra), med(rb)];
}

async function main(): Promise<void> {
  console.log(`Skywell render bench: ${os.availableParallelism()} cores, Node ${process.version}, load average (1/5/15 min) ${load()}`);
  const tStart = performance.now();
  const pool1 = createRenderPool(1);
  const pool2 = createRenderPool(2);
  await Promise.all([pool1.ready(), pool2.ready()]);
  console.log(`worker pools of 1 and 2 threads started in ${((performance.now() - tStart) / 1000).toFixed(2)} s (tsx loading; excluded from every timing below)`);

  // 1. lensed vs plain remap, 2 threads
  const plainReq = { ...base, effects: { lensing: false } };
  const [lensed2, plain2] = await alternate({ req: base, pool: pool2 }, { req: plainReq, pool: pool2 });
  console.log(
    `[1] 1024x1024 dome, stars + Milky Way, 2 threads, median of ${REPEATS}: lensed ${lensed2.totalS.toFixed(3)} s, plain remap ${plain2.totalS.toFixed(3)} s` +
      ` -> lensed/plain = ${(lensed2.totalS / plain2.totalS).toFixed(2)} (target <= 1.5)`,
  );

  // 3 (measured before 2, while both pools are warm): the same frame on 1 and 2 threads, same code path
  const [lensed1, lensed2b] = await alternate({ req: base, pool: pool1 }, { req: base, pool: pool2 });
  const speedup = lensed1.totalS / lensed2b.totalS;
  console.log(
    `[3] same 1024x1024 frame, warm pools, 1 warm-up + median of ${REPEATS}, alternating: 1 thread ${lensed1.totalS.toFixed(3)} s, 2 threads ${lensed2b.totalS.toFixed(3)} s` +
      ` -> speed-up ${speedup.toFixed(2)} (target >= 1.8); fastest of ${REPEATS}: ${lensed1.bestS.toFixed(3)} s vs ${lensed2b.bestS.toFixed(3)} s -> ${(lensed1.bestS / lensed2b.bestS).toFixed(2)};` +
      ` bands stage alone (shading + PNG compression, medians): ${lensed1.bandsS.toFixed(3)} s vs ${lensed2b.bandsS.toFixed(3)} s -> ${(lensed1.bandsS / lensed2b.bandsS).toFixed(2)}`,
  );

  // 2. brute force on this thread: a grid sample of the same frame, extrapolated to every pixel
  const req = parseFrameRequest(base);
  const plan = prepareFrame(req, await loadSkyAssets(req));
  const xy: number[] = [];
  for (let y = BRUTE_STRIDE >> 1; y < req.height; y += BRUTE_STRIDE) for (let x = BRUTE_STRIDE >> 1; x < req.width; x += BRUTE_STRIDE) xy.push(x, y);
  renderPixelsBruteForce(plan, xy.slice(0, 64)); // JIT warm-up
  const tracer = createBruteForceTracer(plan)!;
  const t0 = performance.now();
  renderPixelsBruteForce(plan, xy, tracer);
  const sampleS = (performance.now() - t0) / 1000;
  const samples = xy.length / 2;
  const bruteFrameS = (sampleS * (req.width * req.height)) / samples;
  console.log(
    `[2] brute force: ${samples} pixels (one per ${BRUTE_STRIDE}x${BRUTE_STRIDE} block, ${tracer.rays} inside the dome) each integrated with odex ` +
      `(GBS extrapolation, rtol = atol = ${BRUTE_FORCE_TOLERANCE}, ${(tracer.steps / tracer.rays).toFixed(1)} steps per ray) and shaded like the lensed render, ` +
      `${sampleS.toFixed(2)} s on 1 core; extrapolated to all ${req.width * req.height} pixels: ${bruteFrameS.toFixed(1)} s on 1 core ` +
      `vs lensed ${lensed1.totalS.toFixed(3)} s on 1 thread -> brute/lensed = ${(bruteFrameS / lensed1.totalS).toFixed(0)} (target >= 300)`,
  );
  await pool1.close();

  // 4. 4096 x 4096 dome master, 2 threads (warm pool, fresh frame: ray table and frame plan built as in production)
  const big = { ...base, width: 4096, height: 4096 };
  const px = 4096 * 4096;
  const runs: string[] = [];
  let best = Infinity;
  let bestPerCore = 0;
  for (let i = 0; i < 2; i++) {
    const t = performance.now();
    const result = await renderFrameToImage({ ...big, massSolar: 7e6 + i }, { pool: pool2 });
    const seconds = (performance.now() - t) / 1000;
    const tm = result.timings;
    if (seconds < best) {
      best = seconds;
      bestPerCore = px / tm.shadeThreadS;
    }
    runs.push(
      `${seconds.toFixed(2)} s (ray table ${tm.tableS.toFixed(2)} s, bands ${tm.bandsS.toFixed(2)} s [thread time: shading ${tm.shadeThreadS.toFixed(2)} s, ` +
        `PNG compression ${tm.compressThreadS.toFixed(2)} s], joining ${tm.encodeS.toFixed(2)} s; ${(result.bytes.length / 2 ** 20).toFixed(1)} MiB)`,
    );
  }
  await pool2.close();
  const peakMiB = process.resourceUsage().maxRSS / 1024;
  console.log(`[4] 4096x4096 dome master, stars + Milky Way, PNG8, 2 threads: ${runs.join('; ')}`);
  console.log(
    `    best ${best.toFixed(2)} s (target < 10 s); peak RSS ${peakMiB.toFixed(0)} MiB (process high-water mark over the whole bench, target < 1536 MiB); ` +
      `${(bestPerCore / 1e6).toFixed(2)} Mpixel/s per core while shading (${(px / best / 2 / 1e6).toFixed(2)} Mpixel/s per core over the whole frame)`,
  );
  console.log(`load average at the end (1/5/15 min): ${load()}`);
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
