/**
 * Photosensitivity check of a rendered frame sequence: WCAG 2.2 success
 * criterion 2.3.1 (Three Flashes or Below Threshold) with its definition of the
 * general flash and red flash thresholds; ITU-R BT.1702 applies the same
 * luminance-change and red-flash ideas to broadcast.
 *
 * Method (one pass, frames fed as they land):
 * 1. Working resolution. Each frame is cut into square cells of k x k pixels,
 *    k the largest whole number with k times the frame's coarsest pixel at most
 *    0.25 degree (option maxCellDeg). A 4096 px, 180-degree dome master has
 *    0.044-degree pixels, so k = 5 and cells of 0.22 degree (820 x 820 cells).
 *    A cell's colour is the mean linear-light RGB of its pixels (a box filter;
 *    within a cell the pixels' solid angles differ by well under 1%), and its
 *    area is the exact sum of its pixels' solid angles, measured from the
 *    renderer's projector (lib/render/projections.ts) as seen from the
 *    projection centre: for a dome master, the centre seat.
 * 2. Per cell: relative luminance L (WCAG 2.2) and a zig-zag detector of
 *    transitions between peaks and valleys: a swing of >= 0.1 in L with the
 *    darker state below 0.8 (WCAG 2.2's note defines a transition between
 *    adjacent peaks and valleys). For red: R/(R+G+B) >= 0.8 in linear light and
 *    CIE 1976 u'v' (IEC 61966-2-1 matrix) more than 0.2 from the other state.
 * 3. Fields. 10-degree visual fields are caps of 5-degree radius centred on a
 *    grid of directions 2.5 degrees apart (option fieldSpacingDeg); a cell
 *    belongs to every field whose centre is within 5 degrees of it. Per frame
 *    step each field sums the solid angle of its cells transitioning up and
 *    down; a field transitions when either sum exceeds 0.006 sr.
 * 4. Flashes. A flash is a pair of opposing transitions of the same field; the
 *    count of each field is kept over a sliding one-second window (two steps
 *    share a window when they are less than frameRate steps apart, so 29.97 fps
 *    and 30 fps both hold 30 steps, 24 fps holds 24). More than three flashes in
 *    any window of any field fails, separately for general and red flashes.
 *    When a field rises and falls by more than 0.006 sr in the same step (parts
 *    in counter-phase), that step counts once, opposing the field's last transition.
 * Only per-cell states (a few numbers per cell) and the last second of field
 * transitions are kept, never the frames.
 *
 * Limits (see README.md): patterns finer than a cell (0.1 to 0.25 degree) are
 * averaged away, where WCAG's exception only covers squares under 0.1 degree; a
 * large high-contrast object sweeping across a field by more than 0.006 sr per
 * frame counts as flashing there (conservative); dome tilt does not change solid
 * angles seen from the centre and is ignored.
 */
import type { Projection } from '../render/schema';
import { createProjector, type Projector } from '../render/projections';
import * as colour from './colour';
import { LuminanceSwingTracker, RedTransitionTracker } from './cellTransitions';
import { FieldFlashCounter, type FlashRun } from './flashCounter';
import { buildFieldGrid, type FieldGrid } from './fieldGrid';
import { FLASH_AREA_MAX_SR, FLASH_THRESHOLDS, FLASHES_PER_SECOND_MAX, type FlashThresholds } from './thresholds';
import { buildWorkingGrid, type WorkingGrid } from './workingGrid';

// Module-local copies of the colour functions called per cell per frame: a transpiled import binding (tsx in
// the render workers, the app's bundler) is a getter call on every read, which cost a third of the analysis.
const { buildSrgbDecodeTable, linearRgbToUv, redRatio, relativeLuminance } = colour;

/** Interleaved RGB or RGBA pixel data, rows from the top: 8-bit, 16-bit or float (0..1). */
export type FramePixels = Uint8Array | Uint8ClampedArray | Uint16Array | Float32Array | Float64Array;

/** How pixel values map to light: 'srgb' (encoded, as in 8-bit PNG) or 'linear' (display-linear light). */
export type PixelEncoding = 'srgb' | 'linear';

/** Default largest cell, degrees (brief: a working pixel well under 1 degree). */
export const DEFAULT_MAX_CELL_DEG = 0.25;
/** Default spacing of field centres, degrees (see fieldGrid.ts for why not 5). */
export const DEFAULT_FIELD_SPACING_DEG = 2.5;
/** Frame rates accepted, fps. Common ones: 24, 25, 29.97, 30, 60. */
export const FRAME_RATE_MIN_FPS = 1;
export const FRAME_RATE_MAX_FPS = 240;

/** Geometry and format of a sequence. */
export interface FlashDetectorOptions {
  /** Frame width, px (1..8192). */
  width: number;
  /** Frame height, px (1..8192). */
  height: number;
  /** Frames per second (1..240; e.g. 24, 25, 29.97, 30, 60). */
  frameRate: number;
  /** The frames' projection, as lib/render/schema.ts projectionSchema outputs it (degrees). */
  projection: Projection;
  /** Pixel encoding; default 'srgb'. Linear values above 1 are clipped as the display clips them. */
  encoding?: PixelEncoding;
  /** Values per pixel: 3 (RGB, default) or 4 (RGBA; alpha ignored). */
  channels?: 3 | 4;
  /** Largest working cell, degrees (0.01..2; default 0.25). */
  maxCellDeg?: number;
  /** Spacing of 10-degree field centres, degrees (0.5..5; default 2.5). */
  fieldSpacingDeg?: number;
}

/** Where a field is centred. */
export interface FieldCentre {
  /** Unit view direction (x right, y up, z through the frame centre; for a dome master z is the zenith). */
  viewDirection: [number, number, number];
  /** Angle from the frame centre, degrees (for a dome master: from the zenith). */
  offAxisDeg: number;
  /** Frame position, px from the left and top edges; null when the projection cannot show the direction. */
  pixelX: number | null;
  pixelY: number | null;
}

/** A stretch of the sequence with more than three flashes of one kind in a second. */
export interface FailingRange {
  /** First and last frame of the stretch (0-based). */
  startFrame: number;
  endFrame: number;
  /** The same as times of those frames, s (frame / frameRate). */
  startSeconds: number;
  endSeconds: number;
  /** Most flashes in one one-second window within the stretch. */
  count: number;
  /** Centre of the field that flashed most (of those, the one with the largest flashing area). */
  worstFieldCentre: FieldCentre;
  /** Largest solid angle of that field changing in one frame step, sr (over 0.006 by construction). */
  worstFieldAreaSr: number;
}

/** Findings for one kind of flash. */
export interface FlashKindResult {
  /** Most flashes (each over 0.006 sr of one 10-degree field) in any one-second window. */
  maxPerSecond: number;
  /** Stretches with more than three, in time order. */
  failingRanges: FailingRange[];
}

/** The working resolution a report was made at. */
export interface WorkingResolution {
  /** Cell side, frame pixels. */
  blockPx: number;
  /** Largest cell, degrees. */
  cellDeg: number;
  /** Coarsest frame pixel, degrees. */
  pixelDeg: number;
  /** Cells across and down. */
  columns: number;
  rows: number;
  /** Field-centre spacing, degrees, and the number of fields that cover part of the frame. */
  fieldSpacingDeg: number;
  fieldsInFrame: number;
}

/** Result of the photosensitivity check. */
export interface FlashReport {
  /** 'fail' when either kind has more than three flashes in any second over more than 0.006 sr of a 10-degree field. */
  verdict: 'pass' | 'fail';
  generalFlashes: FlashKindResult;
  redFlashes: FlashKindResult;
  /** One paragraph describing the method, for the delivery's report. */
  method: string;
  thresholds: FlashThresholds;
  /** Frames per second the windows were counted at. */
  frameRate: number;
  framesAnalysed: number;
  workingResolution: WorkingResolution;
}

/** Incremental detector: feed frames in order, then finish. */
export interface FlashDetector {
  /**
   * Analyse the next frame.
   * @param pixels width x height x channels values, rows from the top (see FlashDetectorOptions)
   * @throws RangeError for a wrong length; Error after finish()
   */
  addFrame(pixels: FramePixels): void;
  /** The report over every frame added (callable more than once; no frames may be added after it). */
  finish(): FlashReport;
  /** Frames added so far. */
  readonly framesAdded: number;
}

function checkOptions(o: FlashDetectorOptions): void {
  if (!Number.isInteger(o.width) || o.width < 1 || o.width > 8192) throw new RangeError('width: integer 1..8192 px');
  if (!Number.isInteger(o.height) || o.height < 1 || o.height > 8192) throw new RangeError('height: integer 1..8192 px');
  if (!Number.isFinite(o.frameRate) || o.frameRate < FRAME_RATE_MIN_FPS || o.frameRate > FRAME_RATE_MAX_FPS) {
    throw new RangeError(`frameRate: ${FRAME_RATE_MIN_FPS}..${FRAME_RATE_MAX_FPS} fps`);
  }
  const p = o.projection;
  if (p.kind === 'flat' && !(Number.isFinite(p.fovDeg) && p.fovDeg > 0 && p.fovDeg < 180)) {
    throw new RangeError('projection.fovDeg: greater than 0 and less than 180 degrees');
  }
  if (p.kind === 'dome' && !(Number.isFinite(p.apertureDeg) && p.apertureDeg >= 180 && p.apertureDeg <= 230)) {
    throw new RangeError('projection.apertureDeg: 180..230 degrees');
  }
  if (o.encoding !== undefined && o.encoding !== 'srgb' && o.encoding !== 'linear') throw new RangeError("encoding: 'srgb' or 'linear'");
  if (o.channels !== undefined && o.channels !== 3 && o.channels !== 4) throw new RangeError('channels: 3 or 4');
}

/** The method paragraph for the delivery's report. */
function describeMethod(grid: WorkingGrid, spacingDeg: number, frameRate: number): string {
  return (
    'Checked against WCAG 2.2 success criterion 2.3.1 (Three Flashes or Below Threshold) and its general flash and red flash ' +
    'thresholds, the ideas ITU-R BT.1702 applies to broadcast. Each frame was averaged in linear light into cells of at most ' +
    `${grid.cellDeg.toFixed(2)} degree (${grid.blockPx} x ${grid.blockPx} pixels), each with its exact solid angle as seen from the ` +
    'projection centre (for a dome master, the centre seat). In every cell, relative luminance (sRGB with the IEC 61966-2-1 ' +
    'decoding) was followed from peak to valley: a swing of 0.1 or more with the darker state below 0.8 is a general transition; a ' +
    'change to or from a saturated red (R/(R+G+B) of 0.8 or more) with a CIE 1976 u\'v\' difference above 0.2 is a red transition. ' +
    `Cells were grouped into overlapping 10-degree fields (5-degree caps centred ${spacingDeg} degrees apart); a field transitions ` +
    `when more than ${FLASH_AREA_MAX_SR} sr of it (a quarter of the field) transitions the same way in one frame step, and a flash ` +
    `is a pair of opposing transitions. Flashes were counted per field in every one-second window at ${frameRate} frames per ` +
    `second; more than ${FLASHES_PER_SECOND_MAX} general or red flashes in any window fails.`
  );
}

/**
 * Create an incremental photosensitivity detector for one sequence geometry.
 * Setup measures every pixel's solid angle once (about three projector calls per pixel).
 * @param options frame size (px), frame rate (fps), projection (degrees), encoding and channels
 * @returns the detector
 * @throws RangeError naming the first invalid option
 */
export function createFlashDetector(options: FlashDetectorOptions): FlashDetector {
  checkOptions(options);
  const { width, height, frameRate, projection } = options;
  const encoding: PixelEncoding = options.encoding ?? 'srgb';
  const channels = options.channels ?? 3;
  const maxCellDeg = options.maxCellDeg ?? DEFAULT_MAX_CELL_DEG;
  const spacingDeg = options.fieldSpacingDeg ?? DEFAULT_FIELD_SPACING_DEG;
  const projector = createProjector(projection, width, height);
  const grid = buildWorkingGrid(projector, width, height, maxCellDeg);
  const fields = buildFieldGrid(grid, spacingDeg);
  return new SequenceFlashDetector(options, projector, grid, fields, encoding, channels, spacingDeg);
}

/**
 * Analyse a whole sequence held in memory (or produced by an iterator).
 * @param frames frames in display order (see FlashDetector.addFrame)
 * @param options as for createFlashDetector
 * @returns the report
 */
export function analyseFlashSequence(frames: Iterable<FramePixels>, options: FlashDetectorOptions): FlashReport {
  const detector = createFlashDetector(options);
  for (const frame of frames) detector.addFrame(frame);
  return detector.finish();
}

class SequenceFlashDetector implements FlashDetector {
  private readonly sums: Float64Array;
  private readonly swing: LuminanceSwingTracker;
  private readonly red: RedTransitionTracker;
  private readonly general: FieldFlashCounter;
  private readonly redCounter: FieldFlashCounter;
  private readonly upArea: Float64Array;
  private readonly downArea: Float64Array;
  private readonly redUpArea: Float64Array;
  private readonly redDownArea: Float64Array;
  private readonly touched: Uint8Array;
  private readonly touchedList: Int32Array;
  private readonly uv = new Float64Array(2);
  private readonly table: Float32Array;
  private byteTable: Float32Array | null = null;
  private wordLinearTable: Float32Array | null = null;
  private frames = 0;
  private finished: FlashReport | null = null;

  constructor(
    private readonly options: FlashDetectorOptions,
    private readonly projector: Projector,
    private readonly grid: WorkingGrid,
    private readonly fields: FieldGrid,
    private readonly encoding: PixelEncoding,
    private readonly channels: number,
    private readonly spacingDeg: number,
  ) {
    const n = grid.cellCount;
    const f = fields.fieldCount;
    this.sums = new Float64Array(3 * n);
    this.swing = new LuminanceSwingTracker(n);
    this.red = new RedTransitionTracker(n);
    this.general = new FieldFlashCounter(f, options.frameRate);
    this.redCounter = new FieldFlashCounter(f, options.frameRate);
    this.upArea = new Float64Array(f);
    this.downArea = new Float64Array(f);
    this.redUpArea = new Float64Array(f);
    this.redDownArea = new Float64Array(f);
    this.touched = new Uint8Array(f);
    this.touchedList = new Int32Array(f);
    // 16-bit codes also serve float sRGB input (quantised to 1/65535, far below the 0.1 threshold)
    this.table = encoding === 'srgb' ? buildSrgbDecodeTable(65536) : new Float32Array(0);
  }

  get framesAdded(): number {
    return this.frames;
  }

  addFrame(pixels: FramePixels): void {
    if (this.finished) throw new Error('addFrame: the detector has finished; create a new one for another sequence');
    const expected = this.grid.width * this.grid.height * this.channels;
    if (!pixels || typeof pixels.length !== 'number' || pixels.length !== expected) {
      throw new RangeError(`pixels: length must be width x height x channels = ${expected}`);
    }
    this.sums.fill(0);
    if (pixels instanceof Uint8Array || pixels instanceof Uint8ClampedArray) this.accumulateBytes(pixels);
    else if (pixels instanceof Uint16Array) this.accumulateWords(pixels);
    else if (pixels instanceof Float32Array || pixels instanceof Float64Array) this.accumulateFloats(pixels);
    else throw new RangeError('pixels: Uint8Array, Uint8ClampedArray, Uint16Array, Float32Array or Float64Array');
    this.analyseCells(this.frames);
    this.frames++;
  }

  /** 8-bit codes: sRGB through a 256-entry slice of the decode table, or linear code / 255. */
  private accumulateBytes(px: Uint8Array | Uint8ClampedArray): void {
    if (!this.byteTable) {
      // code i of 8 bits is code 257 i of 16 bits (255 x 257 = 65535)
      this.byteTable = new Float32Array(256);
      for (let i = 0; i < 256; i++) this.byteTable[i] = this.encoding === 'srgb' ? this.table[i * 257] : i / 255;
    }
    this.accumulateCodes(px, this.byteTable);
  }

  /** 16-bit codes: sRGB through the decode table, or linear code / 65535. */
  private accumulateWords(px: Uint16Array): void {
    if (this.encoding === 'srgb') {
      this.accumulateCodes(px, this.table);
      return;
    }
    if (!this.wordLinearTable) {
      this.wordLinearTable = new Float32Array(65536);
      for (let i = 0; i < 65536; i++) this.wordLinearTable[i] = i / 65535;
    }
    this.accumulateCodes(px, this.wordLinearTable);
  }

  private accumulateCodes(px: Uint8Array | Uint8ClampedArray | Uint16Array, lut: Float32Array): void {
    const { width, height, blockPx, columns, rowStart, rowEnd, columnOfPixel } = this.grid;
    const sums = this.sums;
    const ch = this.channels;
    for (let y = 0; y < height; y++) {
      const cellRow = Math.floor(y / blockPx) * columns;
      const x1 = rowEnd[y];
      let p = (y * width + rowStart[y]) * ch;
      for (let x = rowStart[y]; x < x1; x++, p += ch) {
        const o = 3 * (cellRow + columnOfPixel[x]);
        sums[o] += lut[px[p]];
        sums[o + 1] += lut[px[p + 1]];
        sums[o + 2] += lut[px[p + 2]];
      }
    }
  }

  /** Floats 0..1: clipped; sRGB decoded through the 16-bit table. */
  private accumulateFloats(px: Float32Array | Float64Array): void {
    const { width, height, blockPx, columns, rowStart, rowEnd, columnOfPixel } = this.grid;
    const sums = this.sums;
    const ch = this.channels;
    const srgb = this.encoding === 'srgb';
    const lut = this.table;
    for (let y = 0; y < height; y++) {
      const cellRow = Math.floor(y / blockPx) * columns;
      const x1 = rowEnd[y];
      let p = (y * width + rowStart[y]) * ch;
      for (let x = rowStart[y]; x < x1; x++, p += ch) {
        const o = 3 * (cellRow + columnOfPixel[x]);
        for (let k = 0; k < 3; k++) {
          const raw = px[p + k];
          // NaN and negatives read as black, values above 1 as white: what a display shows
          const v = raw > 0 ? (raw < 1 ? raw : 1) : 0;
          sums[o + k] += srgb ? lut[(v * 65535 + 0.5) | 0] : v;
        }
      }
    }
  }

  private analyseCells(step: number): void {
    const { cellCount, cellPixelCount, cellSolidAngleSr } = this.grid;
    const { memberStart, memberField } = this.fields;
    const sums = this.sums;
    const uv = this.uv;
    let touchedCount = 0;
    for (let cell = 0; cell < cellCount; cell++) {
      const count = cellPixelCount[cell];
      if (count === 0) continue;
      const inv = 1 / count;
      const r = sums[3 * cell] * inv;
      const g = sums[3 * cell + 1] * inv;
      const b = sums[3 * cell + 2] * inv;
      const general = this.swing.step(cell, relativeLuminance(r, g, b));
      linearRgbToUv(uv, r, g, b);
      const red = this.red.step(cell, redRatio(r, g, b), uv[0], uv[1]);
      if (general === 0 && red === 0) continue;
      const area = cellSolidAngleSr[cell];
      for (let m = memberStart[cell], end = memberStart[cell + 1]; m < end; m++) {
        const f = memberField[m];
        if (general > 0) this.upArea[f] += area;
        else if (general < 0) this.downArea[f] += area;
        if (red > 0) this.redUpArea[f] += area;
        else if (red < 0) this.redDownArea[f] += area;
        if (this.touched[f] === 0) {
          this.touched[f] = 1;
          this.touchedList[touchedCount++] = f;
        }
      }
    }
    for (let i = 0; i < touchedCount; i++) {
      const f = this.touchedList[i];
      this.general.addStep(f, this.upArea[f], this.downArea[f], step);
      this.redCounter.addStep(f, this.redUpArea[f], this.redDownArea[f], step);
      this.upArea[f] = 0;
      this.downArea[f] = 0;
      this.redUpArea[f] = 0;
      this.redDownArea[f] = 0;
      this.touched[f] = 0;
    }
  }

  finish(): FlashReport {
    if (this.finished) return this.finished;
    const general = this.kindResult(this.general);
    const red = this.kindResult(this.redCounter);
    let fieldsInFrame = 0;
    for (let f = 0; f < this.fields.fieldCount; f++) if (this.fields.cellsPerField[f] > 0) fieldsInFrame++;
    this.finished = {
      verdict: general.failingRanges.length > 0 || red.failingRanges.length > 0 ? 'fail' : 'pass',
      generalFlashes: general,
      redFlashes: red,
      method: describeMethod(this.grid, this.spacingDeg, this.options.frameRate),
      thresholds: { ...FLASH_THRESHOLDS },
      frameRate: this.options.frameRate,
      framesAnalysed: this.frames,
      workingResolution: {
        blockPx: this.grid.blockPx,
        cellDeg: this.grid.cellDeg,
        pixelDeg: this.grid.pixelDeg,
        columns: this.grid.columns,
        rows: this.grid.rows,
        fieldSpacingDeg: this.spacingDeg,
        fieldsInFrame,
      },
    };
    return this.finished;
  }

  private kindResult(counter: FieldFlashCounter): FlashKindResult {
    const fps = this.options.frameRate;
    return {
      maxPerSecond: counter.maxPerSecond,
      failingRanges: counter.failingRuns().map((run: FlashRun) => ({
        startFrame: run.startFrame,
        endFrame: run.endFrame,
        startSeconds: run.startFrame / fps,
        endSeconds: run.endFrame / fps,
        count: run.count,
        worstFieldCentre: this.fieldCentre(run.field),
        worstFieldAreaSr: run.areaSr,
      })),
    };
  }

  private fieldCentre(field: number): FieldCentre {
    const c = this.fields.centre;
    const x = c[3 * field], y = c[3 * field + 1], z = c[3 * field + 2];
    const pixel = new Float64Array(2);
    const shown = this.projector.viewToPixel(pixel, x, y, z);
    return {
      viewDirection: [x, y, z],
      offAxisDeg: (Math.acos(Math.max(-1, Math.min(1, z))) * 180) / Math.PI,
      pixelX: shown ? pixel[0] : null,
      pixelY: shown ? pixel[1] : null,
    };
  }
}
