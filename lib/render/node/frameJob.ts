/**
 * One frame as a list of row bands, rendered by whichever thread claims each
 * band next from a shared counter (Node only). The same code runs inside the
 * pool's worker threads and, for threads = 0, in the calling thread, so the
 * bytes never depend on who rendered what. Band boundaries depend only on
 * the frame width, which keeps the PNG pieces (and so the file) identical
 * whatever the thread count.
 */
import { prepareFrame, type FramePlan, type SkyAssets } from '../frame';
import type { RayTableArrays } from '../engine';
import { RowRenderer, encodeSrgbInto } from '../renderRows';
import type { FrameRequest } from '../schema';
import { compressPngBand, pngBandBytes, writePngScanline, type PngBandPiece } from './png';

/** Pixels per band: small enough to balance two or more threads, large enough to compress well. */
const BAND_PIXELS = 16384;

/** Where a frame's pixels go. */
export type FrameOutput =
  /** PNG: each band is compressed where it was rendered and returned as an IDAT piece */
  | { kind: 'png'; bitDepth: 8 | 16 }
  /** encoded samples written straight into a shared buffer (3 per pixel, row-major), e.g. for JPEG */
  | { kind: 'samples'; bitDepth: 8 | 16; samples: Uint8Array | Uint16Array };

/** Everything a thread needs to render any band of one frame; typed arrays live in shared memory. */
export interface FrameJob {
  /** content hash of the request: the same key means the same frame plan */
  frameKey: string;
  request: FrameRequest;
  lens: RayTableArrays | null;
  assets: SkyAssets;
  /** same key = same asset content (lets workers keep their per-asset caches) */
  assetKey: string;
  output: FrameOutput;
  bandRows: number;
  bandCount: number;
  /** shared counter: element 0 is the next band to claim */
  nextBand: Int32Array;
}

/** Result of one band. */
export interface BandResult {
  band: number;
  /** PNG output only */
  piece: PngBandPiece | null;
  /** thread time spent shading and encoding the band's pixels, ms */
  shadeMs: number;
  /** thread time spent compressing the band, ms (PNG only) */
  compressMs: number;
}

/**
 * Rows per band for a frame width (a function of the width only, see the file comment).
 * @param width frame width, px (>= 1)
 * @returns rows, >= 1
 */
export function bandRowsForWidth(width: number): number {
  if (!Number.isInteger(width) || width < 1) throw new RangeError('width: integer >= 1 px');
  return Math.max(1, Math.floor(BAND_PIXELS / width));
}

let cachedAssets: { key: string; assets: SkyAssets } | null = null;
let cachedPlan: { key: string; plan: FramePlan } | null = null;

/** The frame plan of a job, built once per frame per thread. */
function planFor(job: FrameJob): FramePlan {
  const key = `${job.frameKey}|${job.assetKey}`;
  if (!cachedPlan || cachedPlan.key !== key) {
    // keep one assets object per key so the plan's per-asset caches (star field, mip pyramids) survive frames
    if (!cachedAssets || cachedAssets.key !== job.assetKey) cachedAssets = { key: job.assetKey, assets: job.assets };
    cachedPlan = { key, plan: prepareFrame(job.request, cachedAssets.assets, job.lens) };
  }
  return cachedPlan.plan;
}

/** Renders bands of one job in this thread, reusing its row buffers. */
export class BandRenderer {
  private readonly renderer: RowRenderer;
  private readonly width: number;
  private readonly row: Float32Array;
  private readonly row16: Uint16Array | null;
  private readonly scanlines: Uint8Array | null;

  /** @param job the frame job (its plan is built or reused here) */
  constructor(private readonly job: FrameJob) {
    const plan = planFor(job);
    this.renderer = new RowRenderer(plan);
    this.width = job.request.width;
    this.row = new Float32Array(this.width * 3);
    const out = job.output;
    this.row16 = out.kind === 'png' && out.bitDepth === 16 ? new Uint16Array(this.width * 3) : null;
    this.scanlines = out.kind === 'png' ? new Uint8Array(pngBandBytes(this.width, job.bandRows, out.bitDepth)) : null;
  }

  /**
   * Render one band.
   * @param band band index, 0..bandCount-1
   * @returns the band's result
   */
  render(band: number): BandResult {
    const job = this.job;
    const height = job.request.height;
    const y0 = band * job.bandRows;
    const y1 = Math.min(height, y0 + job.bandRows);
    if (!Number.isInteger(band) || band < 0 || y0 >= height) throw new RangeError(`band: integer 0..${job.bandCount - 1}`);
    const width = this.width;
    const samplesPerRow = width * 3;
    const out = job.output;
    const t0 = performance.now();
    if (out.kind === 'samples') {
      for (let y = y0; y < y1; y++) {
        this.renderer.renderRow(y, this.row, 0);
        encodeSrgbInto(this.row, 0, samplesPerRow, out.samples, y * samplesPerRow);
      }
      return { band, piece: null, shadeMs: performance.now() - t0, compressMs: 0 };
    }
    const scanlines = this.scanlines!;
    const lineBytes = pngBandBytes(width, 1, out.bitDepth);
    for (let y = y0; y < y1; y++) {
      this.renderer.renderRow(y, this.row, 0);
      const at = (y - y0) * lineBytes;
      if (this.row16 === null) {
        scanlines[at] = 0; // filter type 0
        encodeSrgbInto(this.row, 0, samplesPerRow, scanlines, at + 1);
      } else {
        encodeSrgbInto(this.row, 0, samplesPerRow, this.row16, 0);
        writePngScanline(this.row16, 0, samplesPerRow, scanlines, at);
      }
    }
    const t1 = performance.now();
    const piece = compressPngBand(scanlines.subarray(0, (y1 - y0) * lineBytes), band === job.bandCount - 1);
    return { band, piece, shadeMs: t1 - t0, compressMs: performance.now() - t1 };
  }
}

/**
 * Claim and render bands of a job until none is left (the loop every thread runs).
 * @param job frame job
 * @param onBand called with each finished band
 */
export function renderClaimedBands(job: FrameJob, onBand: (result: BandResult) => void): void {
  const renderer = new BandRenderer(job);
  for (;;) {
    const band = Atomics.add(job.nextBand, 0, 1);
    if (band >= job.bandCount) return;
    onBand(renderer.render(band));
  }
}
