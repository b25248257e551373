/**
 * Per-cell transition detectors. WCAG 2.2 (note to "general flash and red flash
 * thresholds"): "A transition is the change in relative luminance (or relative
 * luminance/color for red flashing) between adjacent peaks and valleys in a plot
 * of relative luminance ... against time." So transitions are found between
 * extremes, not between neighbouring frames: a swing of 0.1 spread over several
 * frames is a transition, small wobbles on a slow fade are not.
 */
import { linearRgbToUv } from './colour';
import * as thresholds from './thresholds';

// Module-local copies of the thresholds read per cell per frame: a transpiled import binding (tsx in the render
// workers, the app's bundler) is a getter call on every read.
const { DARKER_STATE_BELOW, LUMINANCE_CHANGE_MIN, RED_CHROMATICITY_CHANGE_ABOVE, SATURATED_RED_RATIO_MIN } = thresholds;

/** Tolerance on the 0.1 step, so an exact 0.1 change read from 8-bit codes is not lost to rounding. */
const LUMINANCE_EPS = 1e-9;
/** Chromaticity u'v' of the sRGB red primary (about 0.451, 0.523): the reference for "farthest from red". */
const RED_PRIMARY_UV = linearRgbToUv(new Float64Array(2), 1, 0, 0);
const RED_PRIMARY_U = RED_PRIMARY_UV[0];
const RED_PRIMARY_V = RED_PRIMARY_UV[1];
const RED_CHANGE_SQ = RED_CHROMATICITY_CHANGE_ABOVE * RED_CHROMATICITY_CHANGE_ABOVE;

/**
 * Zig-zag (peak/valley) detector of general-flash transitions, one state per cell.
 * After an upward transition the cell tracks its running peak; a fall of at least
 * 0.1 from that peak to a state below 0.8 is a downward transition, and so on.
 * Before the first transition both the running minimum and maximum are tracked.
 */
export class LuminanceSwingTracker {
  private readonly low: Float64Array;
  private readonly high: Float64Array;
  private readonly direction: Int8Array;
  private readonly started: Uint8Array;

  /** @param cellCount number of cells (>= 1) */
  constructor(cellCount: number) {
    this.low = new Float64Array(cellCount);
    this.high = new Float64Array(cellCount);
    this.direction = new Int8Array(cellCount);
    this.started = new Uint8Array(cellCount);
  }

  /**
   * Feed the cell's relative luminance for the next frame.
   * @param cell cell index
   * @param luminance relative luminance, 0..1
   * @returns +1 for an upward transition completed at this frame, -1 downward, 0 none
   */
  step(cell: number, luminance: number): number {
    if (this.started[cell] === 0) {
      this.started[cell] = 1;
      this.low[cell] = luminance;
      this.high[cell] = luminance;
      return 0;
    }
    const d = this.direction[cell];
    if (d >= 0 && luminance > this.high[cell]) this.high[cell] = luminance;
    if (d <= 0 && luminance < this.low[cell]) this.low[cell] = luminance;
    // rise from the valley, darker state (the valley) below 0.8 (WCAG 2.2)
    if (d <= 0 && luminance - this.low[cell] >= LUMINANCE_CHANGE_MIN - LUMINANCE_EPS && this.low[cell] < DARKER_STATE_BELOW) {
      this.direction[cell] = 1;
      this.high[cell] = luminance;
      return 1;
    }
    // fall from the peak, darker state (the new level) below 0.8
    if (d >= 0 && this.high[cell] - luminance >= LUMINANCE_CHANGE_MIN - LUMINANCE_EPS && luminance < DARKER_STATE_BELOW) {
      this.direction[cell] = -1;
      this.low[cell] = luminance;
      return -1;
    }
    return 0;
  }
}

const MODE_UNSEEN = 0;
const MODE_RED = 1;
const MODE_OTHER = 2;

/**
 * Detector of red-flash transitions, one state per cell (WCAG 2.2 note, after
 * ISO 9241-391): a transition to or from a state with R/(R+G+B) >= 0.8 whose
 * u'v' distance from the other state is above 0.2. The "other" state is the
 * colour of the non-red run farthest from the red primary, so a cross-fade over
 * several frames still counts; transitions alternate to-red / from-red per cell.
 */
export class RedTransitionTracker {
  private readonly mode: Int8Array;
  private readonly lastEmitted: Int8Array;
  private readonly redU: Float32Array;
  private readonly redV: Float32Array;
  private readonly otherU: Float32Array;
  private readonly otherV: Float32Array;
  private readonly hasRed: Uint8Array;
  private readonly hasOther: Uint8Array;

  /** @param cellCount number of cells (>= 1) */
  constructor(cellCount: number) {
    this.mode = new Int8Array(cellCount);
    this.lastEmitted = new Int8Array(cellCount);
    this.redU = new Float32Array(cellCount);
    this.redV = new Float32Array(cellCount);
    this.otherU = new Float32Array(cellCount);
    this.otherV = new Float32Array(cellCount);
    this.hasRed = new Uint8Array(cellCount);
    this.hasOther = new Uint8Array(cellCount);
  }

  /**
   * Feed the cell's colour for the next frame.
   * @param cell cell index
   * @param ratio R/(R+G+B) of the linear colour, 0..1
   * @param u CIE 1976 u'
   * @param v CIE 1976 v'
   * @returns +1 for a transition to saturated red at this frame, -1 from it, 0 none
   */
  step(cell: number, ratio: number, u: number, v: number): number {
    const isRed = ratio >= SATURATED_RED_RATIO_MIN;
    const mode = this.mode[cell];
    if (isRed) {
      this.redU[cell] = u;
      this.redV[cell] = v;
      this.hasRed[cell] = 1;
      this.mode[cell] = MODE_RED;
      if (mode === MODE_UNSEEN || this.lastEmitted[cell] === 1 || this.hasOther[cell] === 0) return 0;
      const du = u - this.otherU[cell];
      const dv = v - this.otherV[cell];
      if (du * du + dv * dv > RED_CHANGE_SQ) {
        this.lastEmitted[cell] = 1;
        return 1;
      }
      return 0;
    }
    if (mode !== MODE_OTHER) {
      // entering (or starting in) a non-red run
      this.otherU[cell] = u;
      this.otherV[cell] = v;
      this.hasOther[cell] = 1;
    } else {
      const du = u - RED_PRIMARY_U, dv = v - RED_PRIMARY_V;
      const ou = this.otherU[cell] - RED_PRIMARY_U, ov = this.otherV[cell] - RED_PRIMARY_V;
      if (du * du + dv * dv > ou * ou + ov * ov) {
        this.otherU[cell] = u;
        this.otherV[cell] = v;
      }
    }
    this.mode[cell] = MODE_OTHER;
    if (this.hasRed[cell] === 0 || this.lastEmitted[cell] === -1) return 0;
    const du = u - this.redU[cell];
    const dv = v - this.redV[cell];
    if (du * du + dv * dv > RED_CHANGE_SQ) {
      this.lastEmitted[cell] = -1;
      return -1;
    }
    return 0;
  }
}
