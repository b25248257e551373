/**
 * Render a whole frame on all cores (Node only): compute the lensing table once
 * in this thread, put it in shared memory, and let a piscina pool of worker
 * threads render bands of rows into an encoded-sample buffer, which sharp then
 * turns into PNG or JPEG bytes. Memory stays bounded by the final sample buffer
 * plus one band per worker, so 8192 x 8192 frames fit.
 */
import os from 'node:os';
import { createHash } from 'node:crypto';
import Piscina from 'piscina';
import { computeLensTable, type SkyAssets } from '../frame';
import type { RayTableArrays } from '../engine';
import { parseFrameRequest, type FrameRequest } from '../schema';
import { encodeImage } from './encode';
import { renderWorkerFile } from './paths';
import { renderBand, type BandTask } from './worker';
import { loadSkyAssets } from './assets';
import type { StarCatalogue } from '../starCatalogue';

/** Options of {@link renderFrameToImage}. */
export interface RenderFrameOptions {
  /** worker threads; 0 renders in this thread; default: all cores */
  threads?: number;
  /** rows per task; default about 64k pixels per band */
  bandRows?: number;
  /** called after each band with the fraction done, 0..1 */
  onProgress?: (fraction: number) => void;
  /** reuse a pool across frames (its thread count wins over `threads`) */
  pool?: RenderPool;
  /** encoded panorama bytes when the request's panorama source is an asset key, not a file path */
  panoramaBuffer?: Buffer;
}

/** Result of {@link renderFrameToImage}. */
export interface RenderedImage {
  bytes: Buffer;
  width: number;
  height: number;
  format: FrameRequest['output']['format'];
  /** seconds: lensing table, bands (all threads), encoding */
  timings: { tableS: number; bandsS: number; encodeS: number; totalS: number };
}

/** A pool of render worker threads. */
export interface RenderPool {
  threads: number;
  run(task: BandTask): Promise<Uint8Array | Uint16Array>;
  close(): Promise<void>;
}

/**
 * Start a pool of render workers. Worker files are TypeScript, so each worker
 * loads tsx's loader (the project runs its scripts with tsx).
 * @param threads number of worker threads, 1..64
 * @returns the pool; close it when done
 */
export function createRenderPool(threads: number): RenderPool {
  if (!Number.isInteger(threads) || threads < 1 || threads > 64) throw new RangeError('threads: integer 1..64');
  const piscina = new Piscina({
    filename: renderWorkerFile(),
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 60_000,
    execArgv: ['--import', 'tsx'],
  });
  return {
    threads,
    run: (task) => piscina.run(task),
    close: () => piscina.destroy(),
  };
}

/** Copy the engine's ray table into shared memory so every worker reads the same arrays without copies. */
function shareLensTable(table: RayTableArrays | null): RayTableArrays | null {
  if (!table) return null;
  return { layout: shared(table.layout), phi: shared(table.phi), slope: shared(table.slope) };
}

/** Copy a typed array into shared memory. */
function shared<T extends Float32Array | Float64Array | Int32Array>(a: T): T {
  const Ctor = a.constructor as { new (b: SharedArrayBuffer): T };
  const out = new Ctor(new SharedArrayBuffer(a.byteLength));
  out.set(a as never);
  return out;
}

const sharedAssetCache = new Map<string, SkyAssets>();

/** Load a request's sky assets once per process and move them to shared memory for the workers. */
async function sharedSkyAssets(req: FrameRequest, panoramaBuffer?: Buffer): Promise<{ key: string; assets: SkyAssets }> {
  const key = [req.sky.stars.enabled, req.sky.milkyWay.enabled, req.sky.panorama?.source ?? ''].join('|');
  const hit = panoramaBuffer ? undefined : sharedAssetCache.get(key);
  if (hit) return { key, assets: hit };
  const plain = await loadSkyAssets(req, panoramaBuffer);
  const assets: SkyAssets = {};
  if (plain.catalogue) {
    const c: StarCatalogue = plain.catalogue;
    assets.catalogue = { count: c.count, hip: shared(c.hip), raDeg: shared(c.raDeg), decDeg: shared(c.decDeg), mag: shared(c.mag), bv: shared(c.bv) };
  }
  if (plain.milkyWay) assets.milkyWay = { ...plain.milkyWay, data: shared(plain.milkyWay.data) };
  if (plain.panorama) assets.panorama = { ...plain.panorama, rgb: shared(plain.panorama.rgb) };
  if (!panoramaBuffer) sharedAssetCache.set(key, assets);
  return { key: panoramaBuffer ? `${key}|${createHash('sha256').update(panoramaBuffer).digest('hex')}` : key, assets };
}

/**
 * Render a frame request to encoded image bytes.
 * @param input frame request (validated here)
 * @param options threads, band size, progress callback, shared pool
 * @returns bytes, size and timings; the same request gives the same bytes whatever the threads or bands
 */
export async function renderFrameToImage(input: unknown, options: RenderFrameOptions = {}): Promise<RenderedImage> {
  const req = parseFrameRequest(input);
  const { key: assetKey, assets } = await sharedSkyAssets(req, options.panoramaBuffer);
  const t0 = performance.now();
  const lens = shareLensTable(computeLensTable(req));
  const t1 = performance.now();
  const { width, height } = req;
  const bitDepth: 8 | 16 = req.output.format === 'png16' ? 16 : 8;
  const samples = bitDepth === 16 ? new Uint16Array(width * height * 3) : new Uint8Array(width * height * 3);
  const bandRows = options.bandRows ?? Math.max(1, Math.floor(65536 / width));
  if (!Number.isInteger(bandRows) || bandRows < 1) throw new RangeError('bandRows: integer >= 1');
  const frameKey = createHash('sha256').update(JSON.stringify(req)).digest('hex');
  const threads = options.pool ? options.pool.threads : (options.threads ?? os.availableParallelism());
  const ownPool = !options.pool && threads > 0 ? createRenderPool(threads) : null;
  const pool = options.pool ?? ownPool;
  let done = 0;
  try {
    const jobs: Promise<void>[] = [];
    for (let y0 = 0; y0 < height; y0 += bandRows) {
      const y1 = Math.min(height, y0 + bandRows);
      const task: BandTask = { frameKey, request: req, lens, assets, assetKey, y0, y1, bitDepth };
      const run = pool ? pool.run(task) : Promise.resolve(renderBand(task));
      jobs.push(
        run.then((band) => {
          samples.set(band, y0 * width * 3);
          done += y1 - y0;
          options.onProgress?.(done / height);
        }),
      );
      if (!pool) await jobs[jobs.length - 1];
    }
    await Promise.all(jobs);
  } finally {
    await ownPool?.close();
  }
  const t2 = performance.now();
  const bytes = await encodeImage(samples, width, height, req.output.format, req.output.jpegQuality);
  const t3 = performance.now();
  return {
    bytes,
    width,
    height,
    format: req.output.format,
    timings: { tableS: (t1 - t0) / 1000, bandsS: (t2 - t1) / 1000, encodeS: (t3 - t2) / 1000, totalS: (t3 - t0) / 1000 },
  };
}
