/**
 * Photosensitivity check benchmark (issue 6), run with
 * `npx tsx tests/unit/safety/flashDetector.bench.ts` (kept beside the tests: tests/bench belongs to another folder owner).
 * Prints figures measured side by side in one run:
 * - setup (solid angles and fields, once per sequence) and analysis per frame of a 4096 x 4096 8-bit dome master
 * - analysis per frame / one plain pass summing the frame's bytes (the floor any check must pay)
 * - analysis per frame at full resolution (1 px cells) / at the working resolution (2 px cells), 2048 x 2048
 * - 300 frames of 4096 x 4096 extrapolated from the median frame, and peak RSS
 * Exits 0; nothing is asserted.
 */
import os from 'node:os';
import { createFlashDetector } from '@/lib/safety/flashDetector';
import type { Projection } from '@/lib/render/schema';

const DOME: Projection = { kind: 'dome', apertureDeg: 180, tiltDeg: 0 };

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

/** Two 8-bit frames: a radial gradient and its negative (every pixel swings, the worst case for the field step). */
function frames(size: number): [Uint8Array, Uint8Array] {
  const a = new Uint8Array(size * size * 3);
  const b = new Uint8Array(size * size * 3);
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      const v = Math.floor((255 * ((x + y) % size)) / size);
      const o = 3 * (y * size + x);
      a[o] = a[o + 1] = a[o + 2] = v;
      b[o] = b[o + 1] = b[o + 2] = 255 - v;
    }
  }
  return [a, b];
}

function plainPass(px: Uint8Array): number {
  let s = 0;
  for (let i = 0; i < px.length; i++) s += px[i];
  return s;
}

function timeFrames(size: number, maxCellDeg: number, count: number, pair: [Uint8Array, Uint8Array]) {
  let t = performance.now();
  const detector = createFlashDetector({ width: size, height: size, frameRate: 30, projection: DOME, maxCellDeg });
  const setupS = (performance.now() - t) / 1000;
  const perFrame: number[] = [];
  const plain: number[] = [];
  let sink = 0;
  for (let i = 0; i < count; i++) {
    t = performance.now();
    sink += plainPass(pair[i % 2]);
    plain.push((performance.now() - t) / 1000);
    t = performance.now();
    detector.addFrame(pair[i % 2]);
    perFrame.push((performance.now() - t) / 1000);
  }
  const report = detector.finish();
  return { setupS, frameS: median(perFrame.slice(1)), plainS: median(plain), report, sink };
}

const big = timeFrames(4096, 0.25, 7, frames(4096));
const res = big.report.workingResolution;
console.log(`4096 x 4096 dome master, 180 deg: cells ${res.blockPx} x ${res.blockPx} px = ${res.cellDeg.toFixed(3)} deg (${res.columns} x ${res.rows}), ${res.fieldsInFrame} fields at ${res.fieldSpacingDeg} deg`);
console.log(`setup: ${big.setupS.toFixed(2)} s; per frame: ${big.frameS.toFixed(3)} s; plain byte pass: ${big.plainS.toFixed(3)} s`);
console.log(`ratio per frame / plain byte pass: ${(big.frameS / big.plainS).toFixed(2)}`);
console.log(`300 frames extrapolated: ${(big.setupS + 300 * big.frameS).toFixed(1)} s (verdict on the test pair: ${big.report.verdict}, max ${big.report.generalFlashes.maxPerSecond}/s)`);

const small = frames(2048);
const working = timeFrames(2048, 0.25, 7, small);
const full = timeFrames(2048, 0.01, 7, small);
console.log(`2048 x 2048: working cells ${working.report.workingResolution.blockPx} px ${working.frameS.toFixed(3)} s/frame, full-resolution cells ${full.frameS.toFixed(3)} s/frame`);
console.log(`ratio full resolution / working resolution per frame: ${(full.frameS / working.frameS).toFixed(2)}; setup ${(full.setupS / working.setupS).toFixed(2)}`);
console.log(`peak RSS: ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB; load average ${os.loadavg().map((l) => l.toFixed(1)).join(' ')}`);
