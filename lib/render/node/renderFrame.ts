/**
 * Render a whole frame on all cores (Node only): compute the lensing table
 * once in this thread and put it in shared memory, let the pool's workers
 * share the frame's row bands through an atomic counter, and join the result.
 * PNG bands are compressed by the worker that rendered them and joined here
 * as IDAT chunks (png.ts), so encoding runs in parallel too; JPEG samples are
 * written into one shared buffer and encoded by sharp. Memory stays bounded
 * by the compressed frame (PNG) or the sample buffer (JPEG), so 8192 x 8192
 * frames fit.
 */
import os from 'node:os';
import { createHash } from 'node:crypto';
import { computeLensTable, type SkyAssets } from '../frame';
import type { RayTableArrays } from '../engine';
import { parseFrameRequest, type FrameRequest } from '../schema';
import type { StarCatalogue } from '../starCatalogue';
import { encodeImage } from './encode';
import { loadSkyAssets } from './assets';
import { assemblePng, type PngBandPiece } from './png';
import { bandRowsForWidth, renderClaimedBands, type BandResult, type FrameJob, type FrameOutput } from './frameJob';
import { createRenderPool, type RenderPool } from './renderPool';

export { createRenderPool, type RenderPool };

/** Options of {@link renderFrameToImage}. */
export interface RenderFrameOptions {
  /** worker threads; 0 renders in this thread; default: all cores */
  threads?: number;
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
  /**
   * Seconds. Wall clock: lensing table, bands (shading and, for PNG, compression, on all threads),
   * final encoding (PNG: joining the pieces; JPEG: sharp), total. Thread time summed over threads:
   * shading, compression.
   */
  timings: { tableS: number; bandsS: number; encodeS: number; totalS: number; shadeThreadS: number; compressThreadS: number };
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
 * @param options threads, progress callback, shared pool, panorama bytes
 * @returns bytes, size and timings; the same request gives the same bytes whatever the threads
 * @throws RangeError for an invalid request or thread count
 */
export async function renderFrameToImage(input: unknown, options: RenderFrameOptions = {}): Promise<RenderedImage> {
  const req = parseFrameRequest(input);
  const threads = options.pool ? options.pool.threads : (options.threads ?? os.availableParallelism());
  if (!Number.isInteger(threads) || threads < 0 || threads > 64) throw new RangeError('options.threads: integer 0..64');
  const { key: assetKey, assets } = await sharedSkyAssets(req, options.panoramaBuffer);
  const t0 = performance.now();
  const lens = shareLensTable(computeLensTable(req));
  const t1 = performance.now();
  const { width, height } = req;
  const format = req.output.format;
  const bitDepth: 8 | 16 = format === 'png16' ? 16 : 8;
  let output: FrameOutput;
  if (format === 'jpeg') {
    output = { kind: 'samples', bitDepth, samples: new Uint8Array(new SharedArrayBuffer(width * height * 3)) };
  } else {
    output = { kind: 'png', bitDepth };
  }
  const bandRows = bandRowsForWidth(width);
  const bandCount = Math.ceil(height / bandRows);
  const job: FrameJob = {
    frameKey: createHash('sha256').update(JSON.stringify(req)).digest('hex'),
    request: req,
    lens,
    assets,
    assetKey,
    output,
    bandRows,
    bandCount,
    nextBand: new Int32Array(new SharedArrayBuffer(4)),
  };
  const pieces: PngBandPiece[] = new Array(bandCount);
  let rowsDone = 0;
  let shadeMs = 0;
  let compressMs = 0;
  const onBand = (result: BandResult) => {
    if (result.piece) pieces[result.band] = result.piece;
    shadeMs += result.shadeMs;
    compressMs += result.compressMs;
    rowsDone += Math.min(bandRows, height - result.band * bandRows);
    options.onProgress?.(rowsDone / height);
  };
  const ownPool = !options.pool && threads > 0 ? createRenderPool(threads) : null;
  const pool = options.pool ?? ownPool;
  try {
    if (pool) await pool.renderJob(job, onBand);
    else renderClaimedBands(job, onBand);
  } finally {
    await ownPool?.close();
  }
  const t2 = performance.now();
  const bytes =
    output.kind === 'png'
      ? assemblePng(width, height, bitDepth, pieces)
      : await encodeImage(Buffer.from(output.samples.buffer, 0, output.samples.byteLength), width, height, 'jpeg', req.output.jpegQuality);
  const t3 = performance.now();
  return {
    bytes,
    width,
    height,
    format,
    timings: {
      tableS: (t1 - t0) / 1000,
      bandsS: (t2 - t1) / 1000,
      encodeS: (t3 - t2) / 1000,
      totalS: (t3 - t0) / 1000,
      shadeThreadS: shadeMs / 1000,
      compressThreadS: compressMs / 1000,
    },
  };
}
