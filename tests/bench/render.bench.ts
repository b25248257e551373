/**
 * Render benchmark (issue 4), run with `npx tsx tests/bench/render.bench.ts`.
 * Prints figures measured side by side in one run on the same sky and projection:
 * - lensed frame time / plain sky remap (lensing off), 1024 x 1024 dome master, target <= 1.5
 * - brute-force geodesic integration per pixel / lensed, target >= 300 (brute force timed on a
 *   sample of pixels and extrapolated, as stated in the output)
 * - 2-thread speed-up over 1 thread, target >= 1.8
 * - a 4096 x 4096 dome master with stars and Milky Way: seconds, peak RSS, pixels/s/core
 * Exits 0; the targets are reported, not asserted.
 */
import os from 'node:os';
import { createRenderPool, renderFrameToImage, type RenderPool } from '../../lib/render/node/renderFrame';
import { observeRay } from '../../lib/relativity';

const base = {
  massSolar: 4.1e6,
  camera: { state: { kind: 'hover', radiusM: 12 }, holeDirection: { raDeg: 266.405, decDeg: -28.936 } },
  projection: { kind: 'dome', apertureDeg: 180 },
  width: 1024,
  height: 1024,
  output: { format: 'png8' },
};

async function timeFrame(req: object, pool: RenderPool): Promise<number> {
  const t = performance.now();
  await renderFrameToImage(req, { pool });
  return (performance.now() - t) / 1000;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/**
 * Brute force: integrate one pixel's backward ray with the Binet equation
 * u'' = 3u^2 - u (u = M/r, physics.md section 5) by fixed-step RK4 in phi until
 * the ray escapes (u <= 0) or reaches the horizon (u >= 1/2).
 */
function integratePixel(r: number, psi: number): number {
  const f = 1 - 2 / r;
  const eps = Math.sqrt(f);
  const energy = eps;
  const b = (r * Math.sin(psi)) / energy;
  let u = 1 / r;
  // du/dphi sign: the backward ray moves outward when cos(psi) > 0 for a hovering camera
  let w = -Math.sign(Math.cos(psi)) * Math.sqrt(Math.max(0, 1 / (b * b) - u * u + 2 * u * u * u));
  if (w === 0) w = -1e-12;
  const h = 1e-3;
  let phi = 0;
  const acc = (x: number) => 3 * x * x - x;
  while (u > 0 && u < 0.5 && phi < 40) {
    const k1u = w;
    const k1w = acc(u);
    const k2u = w + 0.5 * h * k1w;
    const k2w = acc(u + 0.5 * h * k1u);
    const k3u = w + 0.5 * h * k2w;
    const k3w = acc(u + 0.5 * h * k2u);
    const k4u = w + h * k3w;
    const k4w = acc(u + h * k3u);
    u += (h / 6) * (k1u + 2 * k2u + 2 * k3u + k4u);
    w += (h / 6) * (k1w + 2 * k2w + 2 * k3w + k4w);
    phi += h;
  }
  return phi;
}

async function main(): Promise<void> {
  const cores = os.availableParallelism();
  console.log(`Skywell render bench: ${cores} cores, Node ${process.version}`);
  const pool2 = createRenderPool(2);
  const pool1 = createRenderPool(1);
  try {
    const lensedReq = base;
    const plainReq = { ...base, effects: { lensing: false } };
    // warm up both pools (worker start, JIT, star field and map pyramids)
    await timeFrame(lensedReq, pool2);
    await timeFrame(plainReq, pool2);
    await timeFrame(lensedReq, pool1);
    const lensed: number[] = [];
    const plain: number[] = [];
    for (let i = 0; i < 3; i++) {
      lensed.push(await timeFrame({ ...lensedReq, massSolar: 4.1e6 + i }, pool2));
      plain.push(await timeFrame({ ...plainReq, massSolar: 4.1e6 + i }, pool2));
    }
    const tl = median(lensed);
    const tp = median(plain);
    console.log(`1024x1024 dome, stars + Milky Way, 2 threads: lensed ${tl.toFixed(3)} s, plain remap ${tp.toFixed(3)} s`);
    console.log(`  lensed/plain = ${(tl / tp).toFixed(2)} (target <= 1.5)`);

    // brute force: time a sample of pixels' geodesic integrations and extrapolate to the frame
    const sample = 400;
    const t0 = performance.now();
    let sink = 0;
    for (let i = 0; i < sample; i++) sink += integratePixel(12, ((i + 0.5) / sample) * Math.PI);
    const perPixelS = (performance.now() - t0) / 1000 / sample;
    const pixels = Math.PI * 512 * 512; // pixels inside the dome circle
    const bruteS = (perPixelS * pixels) / 2 + tl; // integration split over 2 threads, plus the same shading work
    console.log(
      `brute force (RK4 Binet equation, step 1e-3 rad; ${sample} pixels timed, extrapolated to ${Math.round(pixels)} pixels on 2 threads): ` +
        `${bruteS.toFixed(1)} s  [checksum ${sink.toFixed(1)}, exact phi at psi=1: ${observeRay(12, 1, { kind: 'static' }).phi.toFixed(4)}, RK4 ${integratePixel(12, 1).toFixed(4)}]`,
    );
    console.log(`  brute/lensed = ${(bruteS / tl).toFixed(0)} (target >= 300)`);

    const one: number[] = [];
    const two: number[] = [];
    for (let i = 0; i < 3; i++) {
      one.push(await timeFrame({ ...lensedReq, massSolar: 5e6 + i }, pool1));
      two.push(await timeFrame({ ...lensedReq, massSolar: 5e6 + i }, pool2));
    }
    console.log(`1 thread ${median(one).toFixed(3)} s, 2 threads ${median(two).toFixed(3)} s: speed-up ${(median(one) / median(two)).toFixed(2)} (target >= 1.8)`);
  } finally {
    await pool1.close();
  }

  // 4096 x 4096 dome master with stars and Milky Way, cold: includes the ray table, encoding and sky loading
  let peak = process.memoryUsage().rss;
  const timer = setInterval(() => (peak = Math.max(peak, process.memoryUsage().rss)), 50);
  const big = { ...base, width: 4096, height: 4096, massSolar: 7e6 };
  const t = performance.now();
  const result = await renderFrameToImage(big, { pool: pool2 });
  const seconds = (performance.now() - t) / 1000;
  clearInterval(timer);
  peak = Math.max(peak, process.memoryUsage().rss);
  await pool2.close();
  const px = 4096 * 4096;
  console.log(
    `4096x4096 dome master, stars + Milky Way, PNG8: ${seconds.toFixed(2)} s (target < 10 s; ray table ${result.timings.tableS.toFixed(2)} s, ` +
      `pixels ${result.timings.bandsS.toFixed(2)} s, encoding ${result.timings.encodeS.toFixed(2)} s), peak RSS ${(peak / 2 ** 20).toFixed(0)} MiB (target < 1536 MiB)`,
  );
  console.log(`  ${(px / result.timings.bandsS / 2 / 1e6).toFixed(2)} Mpixel/s per core while rendering pixels (2 threads)`);
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
