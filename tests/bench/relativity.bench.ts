/**
 * Benchmark of the relativity engine: rays per second per core for the exact
 * tracer (observeRay), the per-frame table lookup, and brute-force odex
 * integration of the same rays, measured side by side in one run.
 * Run: npx tsx tests/bench/relativity.bench.ts
 */
import { buildRayTableForRadialObserver, createRayLookup, observeRay } from '../../lib/relativity';
import { odexTraceRay } from '../unit/relativity/support/odexPhotonTracer';

const r = 6;
const energy = 1;
const f = 1 - 2 / r;
const ur = -Math.sqrt(energy * energy - f);
const observer = { kind: 'radial', energy } as const;

function rate(count: number, ms: number): number {
  return count / (ms / 1000);
}

// Rays: a screen's worth of look angles.
const N = 200_000;
const psis = new Float64Array(N);
for (let i = 0; i < N; i++) psis[i] = (Math.PI * (i + 0.5)) / N;

// Warm-up (JIT) then measure table build time for new camera states.
for (let i = 0; i < 20; i++) buildRayTableForRadialObserver(2 + i * 0.5, energy);
const buildTimes: number[] = [];
for (let i = 0; i < 40; i++) {
  const t0 = performance.now();
  buildRayTableForRadialObserver(1.2 + i * 0.37, energy);
  buildTimes.push(performance.now() - t0);
}
buildTimes.sort((a, b) => a - b);
const table = buildRayTableForRadialObserver(r, energy);

// observeRay
let sink = 0;
let t0 = performance.now();
for (let i = 0; i < N; i++) sink += observeRay(r, psis[i], observer).phi;
const exactRate = rate(N, performance.now() - t0);

// Table lookup (allocation-free)
const out = createRayLookup();
const reps = 20;
t0 = performance.now();
for (let k = 0; k < reps; k++) for (let i = 0; i < N; i++) sink += table.lookup(psis[i], out).phi;
const tableRate = rate(N * reps, performance.now() - t0);

// Brute force: odex per ray (tolerance 1e-10), on a subsample
const M = 400;
t0 = performance.now();
for (let i = 0; i < M; i++) sink += odexTraceRay(r, psis[Math.floor(((i + 0.5) / M) * N)], energy, ur, 1e-10).phi;
const bruteRate = rate(M, performance.now() - t0);

// Worst table error vs observeRay outside a 1e-6 band around the shadow edge
let worst = 0;
for (let i = 0; i < N; i++) {
  if (Math.abs(psis[i] - table.shadowEdgePsi) < 1e-6) continue;
  worst = Math.max(worst, Math.abs(table.lookup(psis[i], out).phi - observeRay(r, psis[i], observer).phi));
}

const fmt = (x: number) => (x >= 1e6 ? `${(x / 1e6).toFixed(2)} Mrays/s/core` : `${(x / 1e3).toFixed(2)} krays/s/core`);
console.log(`relativity: camera r = ${r} M, radial fall energy ${energy}, ${N} rays`);
console.log(`relativity: observeRay        ${fmt(exactRate)}`);
console.log(`relativity: table lookup      ${fmt(tableRate)}`);
console.log(`relativity: brute-force odex  ${fmt(bruteRate)}`);
console.log(`relativity: ratio table/brute-force  ${(tableRate / bruteRate).toFixed(0)}x (target >= 1000)`);
console.log(`relativity: ratio observeRay/brute-force  ${(exactRate / bruteRate).toFixed(0)}x`);
console.log(`relativity: table worst |dphi| vs observeRay  ${worst.toExponential(2)} rad outside 1e-6 of the edge (target < 1e-7)`);
console.log(
  `relativity: table build  median ${buildTimes[20].toFixed(2)} ms, max ${buildTimes[39].toFixed(2)} ms over 40 camera states (target < 5 ms)`,
);
if (!Number.isFinite(sink)) console.log('relativity: (sink not finite)');
