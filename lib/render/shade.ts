/**
 * The per-pixel path: view direction -> camera-frame look angle -> ray tracer
 * (the lensing table, or a brute-force integrator) -> sky direction, shift g
 * and footprint -> radiance of stars, Milky Way, panorama, or a grid where the
 * ray ends on the horizon. Allocation-free: one Shader per thread holds all
 * scratch arrays.
 *
 * Radiance unit: mag-0 star fluxes per steradian. A star of flux F adds
 * F * K(d) with K a normalised Gaussian on the sky whose width is the pixel's
 * footprint on the sky times the point-spread sigma; since a screen area
 * dOmega_screen covers J^-1 of it on the sky, the image's total flux is
 * F * g^4 * J (physics.md section 6) and every image of a star (primary,
 * secondary, rings) appears wherever the lensing map sends pixels to it.
 */
import type { FramePlan } from './frame';
import { FATE_FAR_SIDE, FATE_HORIZON, FATE_SKY, boostLookDirection, createRayLookup, type RayLookup } from '../relativity';
import { lookupLensLutIo } from './lensLut';
import { COLOUR_INDEX_PER_LOG, COLOUR_TABLE_ENTRIES, blackbodyColourAtIndex, colourIndexOfLog } from './colourTable';
import { STAR_CELL_SIZE, STAR_STRIDE } from './starField';
import { sampleSkyMapIo } from './skyMap';
import { MILKY_WAY_TEMPERATURE_K } from './milkyWay';
import { createGridPoint, drawLensedGrid } from './grids';

// Module-local bindings of imported values: tsx/esbuild compile imports to property getters on the
// module object, and the per-pixel path should not pay a getter call for each use.
const SKY = FATE_SKY;
const HORIZON = FATE_HORIZON;
const FAR_SIDE = FATE_FAR_SIDE;
const lensLookup = lookupLensLutIo;
const colourAtIndex = blackbodyColourAtIndex;
const sampleMap = sampleSkyMapIo;
const boost = boostLookDirection;
const gridCoverage = drawLensedGrid;
const INDEX_PER_LOG = COLOUR_INDEX_PER_LOG;
const LAST_INDEX = COLOUR_TABLE_ENTRIES - 1;
const CELL = STAR_CELL_SIZE;
const STRIDE = STAR_STRIDE;

/** Largest star kernel sigma (radians) summed star by star; wider footprints read the star-light map. */
const STAR_SIGMA_MAX_RAD = STAR_CELL_SIZE / 3;
const CELLS = Math.ceil(2 / STAR_CELL_SIZE) + 1;
const ARCSEC_RAD = Math.PI / 648000;
const MILKY_WAY_INDEX = colourIndexOfLog(Math.log(MILKY_WAY_TEMPERATURE_K));
const INV_TWO_PI = 1 / (2 * Math.PI);
const INV_PI = 1 / Math.PI;

const TONE_NONE = 0;
const TONE_REINHARD = 1;
const TONE_EXPONENTIAL = 2;

// Indices of Shader.num (per-frame numbers) and Shader.flag (per-frame switches).
const N_PSF_SIGMA_PX = 0;
const N_SOURCE_SIZE_RAD = 1;
const N_STAR_GAIN = 2;
const N_MILKY_WAY_GAIN = 3;
const N_PANORAMA_GAIN = 4;
const N_UNIFORM_BRIGHTNESS = 5;
const N_EXPOSURE = 6;
const N_HORIZON_SPACING_DEG = 7;
const N_HORIZON_WIDTH_PX = 8;
const N_FAR_SIDE_SPACING_DEG = 9;
const N_FAR_SIDE_WIDTH_PX = 10;
const N_PANORAMA_INDEX = 11;
const N_UNIFORM_INDEX = 12;
const NUMBERS = 13;
const F_LENSING = 0;
const F_COLOUR_SHIFT = 1;
const F_BEAMING = 2;
const F_MILKY_WAY = 3;
const F_PANORAMA = 4;
const F_UNIFORM = 5;
const F_HORIZON_GRID = 6;
const F_HORIZON_DASHED = 7;
const F_FAR_SIDE_GRID = 8;
const F_FAR_SIDE_DASHED = 9;
const F_TONE = 10;
const F_SAMPLES = 11;
const FLAGS = 12;

/** Per-sample result: radiance and overlay. */
export interface SampleResult {
  /** radiance r, g, b (mag-0 fluxes per sr, linear sRGB primaries) */
  radiance: Float64Array;
  /** overlay colour (display-linear) premultiplied by coverage, then coverage */
  overlay: Float64Array;
}

/**
 * Traces a look angle of the reference observer to the ray's fate, azimuth swept,
 * dphi/dpsi and shift: the frame's lensing table by default, or a brute-force
 * geodesic integrator (bruteForce.ts) plugged into the same shading.
 */
export interface RayTracer {
  /**
   * @param psi look angle from the outward radial axis in the reference observer's frame, radians, 0..pi
   * @param cosPsi cos(psi)
   * @param out record to fill (fate, phi, dPhiDPsi, g; jacobian is not used)
   * @returns out
   */
  trace(psi: number, cosPsi: number, out: RayLookup): RayLookup;
}

/**
 * Per-thread shading state for one frame plan.
 *
 * Written for V8's optimizing compiler, which this path depends on for its speed: the frame's
 * settings are copied at construction into typed arrays and fields set only here, so the per-pixel
 * code reads no request objects (whose shapes V8 tracks: a change there, e.g. from the next frame's
 * request, deoptimized this code and sometimes left it unoptimized, 4x slower); numbers cross calls
 * only inside typed arrays (a double passed to or returned from a call that is not inlined is boxed,
 * i.e. allocated); and no test compares a value that is usually a small integer but sometimes
 * fractional (integer-only type feedback, then a deoptimization on the rare pixels).
 */
export class Shader {
  /** [0], [1] sample position in pixels; [2..4] view direction; [5] pixel angle (projector io) */
  private readonly io = new Float64Array(6);
  /** lens grid in: [0] psi, [1] cos psi; out: [2] cos phi, [3] sin phi, [4] phi, [5] dphi/dpsi, [6] g, [7] fate */
  private readonly lensIo = new Float64Array(8);
  /** [0] u, [1] v, [2] footprint, [3] scratch for the sky maps */
  private readonly mapIo = new Float64Array(4);
  private readonly look = new Float64Array(3);
  private readonly cam = new Float64Array(3);
  /** [0] last frequency shift seen, [1] its colour-table index offset ln(g) * COLOUR_INDEX_PER_LOG */
  private readonly shiftCache = Float64Array.of(1, 0);
  /** end direction d and its derivatives per output pixel (grids.ts GridPoint) */
  private readonly point = createGridPoint();
  private readonly colour = new Float64Array(3);
  private readonly mapSample = new Float64Array(3);
  private readonly ray = createRayLookup();
  readonly result: SampleResult = { radiance: new Float64Array(3), overlay: new Float64Array(4) };
  /** per-frame numbers (N_* indices) and switches (F_* indices, 0 or 1 unless noted) */
  private readonly num = new Float64Array(NUMBERS);
  private readonly flag = new Int32Array(FLAGS);
  private readonly horizonColour: Float64Array;
  private readonly farSideColour: Float64Array;
  /** unshifted panorama reference colour, to divide out when the panorama's colour is shifted */
  private readonly panoramaBase = new Float64Array(3);
  // the plan's per-frame objects (null where a source is off)
  private readonly projector: FramePlan['projector'];
  private readonly viewToCamera: Float64Array;
  private readonly cameraToHole: Float64Array;
  private readonly velocity: Float64Array | null;
  private readonly lens: FramePlan['lens'];
  private readonly stars: FramePlan['stars'];
  private readonly diffuse: FramePlan['diffuse'];
  private readonly panorama: FramePlan['panorama'];
  private readonly colours: FramePlan['colours'];

  /**
   * @param plan frame plan
   * @param tracer ray tracer replacing the plan's lensing table (brute force), or null to use the table
   */
  constructor(
    plan: FramePlan,
    private readonly tracer: RayTracer | null = null,
  ) {
    const req = plan.req;
    const sky = req.sky;
    const fx = req.effects;
    const num = this.num;
    num[N_PSF_SIGMA_PX] = sky.stars.psfSigmaPx;
    num[N_SOURCE_SIZE_RAD] = sky.stars.sourceSizeArcsec * ARCSEC_RAD;
    num[N_STAR_GAIN] = sky.stars.gain;
    num[N_MILKY_WAY_GAIN] = sky.milkyWay.gain;
    num[N_PANORAMA_GAIN] = sky.panorama ? sky.panorama.gain : 0;
    num[N_UNIFORM_BRIGHTNESS] = sky.uniform ? sky.uniform.brightness : 0;
    num[N_EXPOSURE] = plan.exposure;
    num[N_HORIZON_SPACING_DEG] = fx.horizonGrid.spacingDeg;
    num[N_HORIZON_WIDTH_PX] = fx.horizonGrid.lineWidthPx;
    num[N_FAR_SIDE_SPACING_DEG] = fx.farSideGrid.spacingDeg;
    num[N_FAR_SIDE_WIDTH_PX] = fx.farSideGrid.lineWidthPx;
    num[N_PANORAMA_INDEX] = sky.panorama ? colourIndexOfLog(Math.log(sky.panorama.referenceTemperatureK)) : 0;
    num[N_UNIFORM_INDEX] = sky.uniform ? colourIndexOfLog(Math.log(sky.uniform.temperatureK)) : 0;
    const flag = this.flag;
    flag[F_LENSING] = fx.lensing ? 1 : 0;
    flag[F_COLOUR_SHIFT] = fx.colourShift ? 1 : 0;
    flag[F_BEAMING] = fx.beaming ? 1 : 0;
    flag[F_MILKY_WAY] = sky.milkyWay.enabled ? 1 : 0;
    flag[F_PANORAMA] = sky.panorama && plan.panorama !== null ? 1 : 0;
    flag[F_UNIFORM] = sky.uniform ? 1 : 0;
    flag[F_HORIZON_GRID] = fx.horizonGrid.enabled ? 1 : 0;
    flag[F_HORIZON_DASHED] = fx.horizonGrid.dashed ? 1 : 0;
    flag[F_FAR_SIDE_GRID] = fx.farSideGrid.enabled ? 1 : 0;
    flag[F_FAR_SIDE_DASHED] = fx.farSideGrid.dashed ? 1 : 0;
    const op = req.exposure.toneMap;
    flag[F_TONE] = op === 'none' ? TONE_NONE : op === 'reinhard' ? TONE_REINHARD : TONE_EXPONENTIAL;
    flag[F_SAMPLES] = req.supersampling;
    this.horizonColour = hexToLinear(fx.horizonGrid.colour);
    this.farSideColour = hexToLinear(fx.farSideGrid.colour);
    colourAtIndex(plan.colours, num[N_PANORAMA_INDEX], this.panoramaBase);
    this.projector = plan.projector;
    this.viewToCamera = plan.viewToCamera;
    this.cameraToHole = plan.cameraToHole;
    this.velocity = fx.lensing ? plan.optics.velocity : null;
    this.lens = plan.lens;
    this.stars = plan.stars;
    this.diffuse = plan.diffuse;
    this.panorama = plan.panorama;
    this.colours = plan.colours;
  }

  /**
   * Display-linear RGB of one output pixel: its n x n samples averaged (box filter), exposure and
   * tone mapping applied (toneMap.ts operators), overlays composited over the result.
   * @param x pixel column, 0 at the left
   * @param y pixel row, 0 at the top
   * @param out receives r, g, b at out[at..at+2]
   * @param at index of the red value in out
   */
  shadePixel(x: number, y: number, out: Float32Array, at: number): void {
    const n = this.flag[F_SAMPLES];
    const rad = this.result.radiance;
    const ov = this.result.overlay;
    let r0: number;
    let r1: number;
    let r2: number;
    let o0: number;
    let o1: number;
    let o2: number;
    let a: number;
    if (n === 1) {
      this.shadeSample(x, y, 0, 0);
      r0 = rad[0];
      r1 = rad[1];
      r2 = rad[2];
      o0 = ov[0];
      o1 = ov[1];
      o2 = ov[2];
      a = ov[3];
    } else {
      r0 = r1 = r2 = o0 = o1 = o2 = a = 0;
      for (let sy = 0; sy < n; sy++) {
        for (let sx = 0; sx < n; sx++) {
          this.shadeSample(x, y, sx, sy);
          r0 += rad[0];
          r1 += rad[1];
          r2 += rad[2];
          o0 += ov[0];
          o1 += ov[1];
          o2 += ov[2];
          a += ov[3];
        }
      }
      const inv = 1 / (n * n);
      r0 *= inv;
      r1 *= inv;
      r2 *= inv;
      o0 *= inv;
      o1 *= inv;
      o2 *= inv;
      a *= inv;
    }
    const scale = this.num[N_EXPOSURE];
    r0 *= scale;
    r1 *= scale;
    r2 *= scale;
    const tone = this.flag[F_TONE];
    if (tone === TONE_EXPONENTIAL) {
      // photographic film response, per channel (toneMap.ts)
      r0 = 1 - Math.exp(-r0);
      r1 = 1 - Math.exp(-r1);
      r2 = 1 - Math.exp(-r2);
    } else if (tone === TONE_REINHARD) {
      // Reinhard et al. 2002 on luminance, keeping hue (toneMap.ts)
      const s = 1 / (1 + 0.2126 * r0 + 0.7152 * r1 + 0.0722 * r2);
      r0 *= s;
      r1 *= s;
      r2 *= s;
    }
    // overlay composited unconditionally (exact when a = 0, see the class comment)
    r0 = r0 * (1 - a) + o0;
    r1 = r1 * (1 - a) + o1;
    r2 = r2 * (1 - a) + o2;
    out[at] = r0;
    out[at + 1] = r1;
    out[at + 2] = r2;
  }

  /**
   * Shade one sample point of the frame.
   * @param px frame x in pixels from the left edge
   * @param py frame y in pixels from the top edge
   * @param samplesPerAxis supersampling factor n (the sample spacing is 1/n px), 1..4
   * @returns the shared result record (overwritten by the next call)
   */
  shade(px: number, py: number, samplesPerAxis: number): SampleResult {
    if (!Number.isInteger(samplesPerAxis) || samplesPerAxis < 1 || samplesPerAxis > 4) throw new RangeError('samplesPerAxis: integer 1..4');
    this.io[0] = px;
    this.io[1] = py;
    return this.shadeIo(samplesPerAxis);
  }

  /**
   * Shade sample (sx, sy) of pixel (x, y) on an n x n grid, n = the request's supersampling
   * (integers only, so nothing is boxed by the call).
   * @param x pixel column, 0 at the left
   * @param y pixel row, 0 at the top
   * @param sx sample column inside the pixel, 0..n-1
   * @param sy sample row inside the pixel, 0..n-1
   * @returns the shared result record (overwritten by the next call)
   */
  shadeSample(x: number, y: number, sx: number, sy: number): SampleResult {
    const n = this.flag[F_SAMPLES];
    this.io[0] = x + (sx + 0.5) / n;
    this.io[1] = y + (sy + 0.5) / n;
    return this.shadeIo(n);
  }

  /** Shade the sample whose position is in io[0], io[1]; n is the supersampling factor (integer). */
  private shadeIo(samplesPerAxis: number): SampleResult {
    const num = this.num;
    const flag = this.flag;
    const rad = this.result.radiance;
    const ov = this.result.overlay;
    rad[0] = rad[1] = rad[2] = 0;
    ov[0] = ov[1] = ov[2] = ov[3] = 0;
    const io = this.io;
    this.projector.project(io);
    const pixelRad = io[5];
    if (pixelRad < 0) return this.result;
    const v0 = io[2];
    const v1 = io[3];
    const v2 = io[4];
    const m = this.viewToCamera;
    // camera-frame look direction n (e1 outward radial)
    let n1 = m[0] * v0 + m[1] * v1 + m[2] * v2;
    let n2 = m[3] * v0 + m[4] * v1 + m[5] * v2;
    let n3 = m[6] * v0 + m[7] * v1 + m[8] * v2;
    let doppler = 1;
    const velocity = this.velocity;
    if (velocity !== null) {
      // aberrate into the reference observer's frame (lib/relativity boostLookDirection, Einstein 1905);
      // the Doppler factor D = 1 / (gamma (1 - v . n)) is recomputed here rather than returned (a boxed double)
      const look = this.look;
      const c = this.cam;
      look[0] = n1;
      look[1] = n2;
      look[2] = n3;
      boost(c, look, velocity);
      const vx = velocity[0];
      const vy = velocity[1];
      const vz = velocity[2];
      doppler = Math.sqrt(1 - (vx * vx + vy * vy + vz * vz)) / (1 - (vx * n1 + vy * n2 + vz * n3));
      n1 = c[0];
      n2 = c[1];
      n3 = c[2];
    }
    let sinPsi = Math.sqrt(n2 * n2 + n3 * n3);
    let t2 = 1;
    let t3 = 0;
    if (sinPsi > 1e-15) {
      t2 = n2 / sinPsi;
      t3 = n3 / sinPsi;
    } else {
      sinPsi = 0;
    }
    const psi = Math.atan2(sinPsi, n1);
    // the ray: fate, cos and sin of phi, dphi/dpsi, g (locals, not object fields, in the table path)
    let fate: number;
    let cp: number;
    let sp: number;
    let radialRate: number;
    let gRef: number;
    const lens = this.lens;
    if (this.tracer === null && lens !== null) {
      const lensIo = this.lensIo;
      lensIo[0] = psi;
      lensIo[1] = n1;
      lensLookup(lens, lensIo, this.ray);
      cp = lensIo[2];
      sp = lensIo[3];
      radialRate = lensIo[5];
      gRef = lensIo[6];
      fate = lensIo[7] | 0; // an integer, so the fate tests below compare small integers, not doubles
    } else {
      const ls = this.ray;
      if (this.tracer !== null) {
        this.tracer.trace(psi, n1, ls);
      } else {
        ls.fate = SKY;
        ls.phi = psi;
        ls.g = 1;
        ls.dPhiDPsi = 1;
      }
      cp = Math.cos(ls.phi);
      sp = Math.sin(ls.phi);
      radialRate = ls.dPhiDPsi;
      gRef = ls.g;
      fate = ls.fate | 0;
    }
    const g = gRef * doppler;
    // sky (or horizon) direction: rotate e1 by phi towards the look direction's transverse part t
    const c2h = this.cameraToHole;
    // e1 and t in the hole frame
    const e1x = c2h[0];
    const e1y = c2h[3];
    const e1z = c2h[6];
    const tx = c2h[1] * t2 + c2h[2] * t3;
    const ty = c2h[4] * t2 + c2h[5] * t3;
    const tz = c2h[7] * t2 + c2h[8] * t3;
    const dx = cp * e1x + sp * tx;
    const dy = cp * e1y + sp * ty;
    const dz = cp * e1z + sp * tz;
    // sky angle per screen angle: radial |dphi/dpsi|, tangential |sin phi| / sin psi. Aberration is
    // conformal with angular scale D (d theta_ref / d theta_camera = D, Einstein 1905), so a camera
    // pixel spans D times its angle in the reference frame.
    const pixelRefRad = pixelRad * doppler;
    const tangentialRate = sinPsi > 1e-9 ? sp / sinPsi : radialRate;
    const radial = Math.abs(radialRate);
    const tangential = Math.abs(tangentialRate);
    const footRad = pixelRefRad * (radial > tangential ? radial : tangential);

    if (fate === HORIZON || fate === FAR_SIDE) {
      const horizon = fate === HORIZON;
      if (flag[horizon ? F_HORIZON_GRID : F_FAR_SIDE_GRID] === 1) {
        // derivative of d per output pixel: along psi it turns by dphi/dpsi towards (-sin phi e1 + cos phi t);
        // across, the rotation plane turns about e1, moving d by sin(phi)/sin(psi) along e1 x t
        const p = this.point;
        const a = radialRate * pixelRefRad;
        const b = tangentialRate * pixelRefRad;
        p[0] = dx;
        p[1] = dy;
        p[2] = dz;
        p[3] = a * (cp * tx - sp * e1x);
        p[4] = a * (cp * ty - sp * e1y);
        p[5] = a * (cp * tz - sp * e1z);
        // e1 x t = c2h (0, -t3, t2)
        p[6] = b * (c2h[2] * t2 - c2h[1] * t3);
        p[7] = b * (c2h[5] * t2 - c2h[4] * t3);
        p[8] = b * (c2h[8] * t2 - c2h[7] * t3);
        if (horizon) gridCoverage(p, num[N_HORIZON_SPACING_DEG], num[N_HORIZON_WIDTH_PX], 1 / samplesPerAxis, flag[F_HORIZON_DASHED] === 1);
        else gridCoverage(p, num[N_FAR_SIDE_SPACING_DEG], num[N_FAR_SIDE_WIDTH_PX], 1 / samplesPerAxis, flag[F_FAR_SIDE_DASHED] === 1);
        const cover = p[9];
        const col = horizon ? this.horizonColour : this.farSideColour;
        ov[0] = col[0] * cover;
        ov[1] = col[1] * cover;
        ov[2] = col[2] * cover;
        ov[3] = cover;
      }
      return this.result;
    }

    const shifting = flag[F_COLOUR_SHIFT] === 1;
    const shift = shifting ? g : 1;
    // colour-table shift ln(g) per ln T; g repeats from pixel to pixel for hovering cameras, so keep the last
    // log ((< and > rather than !==: a strict equality on doubles makes V8 box them)
    const shiftCache = this.shiftCache;
    if (shift < shiftCache[0] || shift > shiftCache[0]) {
      shiftCache[0] = shift;
      shiftCache[1] = Math.log(shift) * INDEX_PER_LOG;
    }
    const shiftIndex = shiftCache[1];
    const colours = this.colours;
    const rgb = colours.rgb;
    const col = this.colour;
    const sampleFoot = footRad / samplesPerAxis;
    let r0 = 0;
    let r1 = 0;
    let r2 = 0;

    // stars, one by one while the kernel is narrow; ramp runs from 0 to 1 as the kernel widens from half
    // the largest per-star sigma to all of it (tests on ramp, never on the 0..1 weight, see the class comment)
    const starSigma = Math.max(num[N_PSF_SIGMA_PX] * footRad, num[N_SOURCE_SIZE_RAD]);
    const ramp = (starSigma - 0.5 * STAR_SIGMA_MAX_RAD) / (0.5 * STAR_SIGMA_MAX_RAD);
    const mapWeight = ramp <= 0 ? 0 : ramp >= 1 ? 1 : ramp * ramp * (3 - 2 * ramp);
    const field = this.stars;
    if (field !== null && ramp < 1) {
      const reach = 3 * starSigma;
      const reach2 = reach * reach;
      const inv2s2 = 1 / (2 * starSigma * starSigma);
      const norm = (num[N_STAR_GAIN] * (1 - mapWeight)) / (2 * Math.PI * starSigma * starSigma);
      const x0 = Math.floor((dx - reach + 1) / CELL);
      const x1 = Math.floor((dx + reach + 1) / CELL);
      const y0 = Math.floor((dy - reach + 1) / CELL);
      const y1 = Math.floor((dy + reach + 1) / CELL);
      const z0 = Math.max(0, Math.floor((dz - reach + 1) / CELL));
      const z1 = Math.min(CELLS - 1, Math.floor((dz + reach + 1) / CELL));
      const start = field.cellStart;
      const stars = field.packed;
      const ixEnd = x1 < CELLS ? x1 : CELLS - 1;
      const iyEnd = y1 < CELLS ? y1 : CELLS - 1;
      for (let ix = x0 < 0 ? 0 : x0; ix <= ixEnd; ix++) {
        for (let iy = y0 < 0 ? 0 : y0; iy <= iyEnd; iy++) {
          const base = (ix * CELLS + iy) * CELLS;
          const end = start[base + z1 + 1];
          for (let s = start[base + z0]; s < end; s++) {
            const o = s * STRIDE;
            const ex = stars[o] - dx;
            const ey = stars[o + 1] - dy;
            const ez = stars[o + 2] - dz;
            const dist2 = ex * ex + ey * ey + ez * ez;
            if (dist2 >= reach2) continue;
            const w = norm * stars[o + 3] * Math.exp(-dist2 * inv2s2);
            // blackbody colour at g T: the star's table index moved by ln(g) (colourTable.ts), inlined
            let x = stars[o + 4] + shiftIndex;
            if (!(x > 0)) x = 0;
            if (x > LAST_INDEX) x = LAST_INDEX;
            let i = Math.floor(x);
            if (i > LAST_INDEX - 1) i = LAST_INDEX - 1;
            const f = x - i;
            const j = 3 * i;
            r0 += w * (rgb[j] + f * (rgb[j + 3] - rgb[j]));
            r1 += w * (rgb[j + 1] + f * (rgb[j + 4] - rgb[j + 1]));
            r2 += w * (rgb[j + 2] + f * (rgb[j + 5] - rgb[j + 2]));
          }
        }
      }
    }

    const diffuse = this.diffuse;
    const panorama = this.panorama;
    if (diffuse !== null || panorama !== null) {
      let u = Math.atan2(dy, dx) * INV_TWO_PI;
      if (u < 0) u += 1;
      const vv = 0.5 - Math.asin(dz > 1 ? 1 : dz < -1 ? -1 : dz) * INV_PI;
      const mapIo = this.mapIo;
      if (diffuse !== null) {
        mapIo[0] = u;
        mapIo[1] = vv;
        mapIo[2] = sampleFoot;
        const s = sampleMap(diffuse, mapIo, this.mapSample);
        if (flag[F_MILKY_WAY] === 1) {
          // blackbody colour at g * 5000 K (colourTable.ts blackbodyColourAtIndex, inlined: no boxed argument);
          // added even where the map is 0, rather than tested (see the class comment)
          const mw = s[0] * num[N_MILKY_WAY_GAIN];
          let x = MILKY_WAY_INDEX + shiftIndex;
          if (!(x > 0)) x = 0;
          if (x > LAST_INDEX) x = LAST_INDEX;
          let i = Math.floor(x);
          if (i > LAST_INDEX - 1) i = LAST_INDEX - 1;
          const f = x - i;
          const j = 3 * i;
          r0 += mw * (rgb[j] + f * (rgb[j + 3] - rgb[j]));
          r1 += mw * (rgb[j + 1] + f * (rgb[j + 4] - rgb[j + 1]));
          r2 += mw * (rgb[j + 2] + f * (rgb[j + 5] - rgb[j + 2]));
        }
        if (field !== null && ramp > 0) {
          // the star-light map for wide kernels: flux-weighted mean temperature of the texel's stars, shifted
          // (no test on s[1]: an empty texel gives flux 0, and its NaN colour index clamps to the table's start)
          const flux = s[1] * num[N_STAR_GAIN] * mapWeight;
          colourAtIndex(colours, colourIndexOfLog(Math.log(s[2] / s[1])) + shiftIndex, col);
          r0 += flux * col[0];
          r1 += flux * col[1];
          r2 += flux * col[2];
        }
      }
      if (panorama !== null && flag[F_PANORAMA] === 1) {
        mapIo[0] = u;
        mapIo[1] = vv;
        mapIo[2] = sampleFoot;
        const s = sampleMap(panorama, mapIo, this.mapSample);
        const gain = num[N_PANORAMA_GAIN];
        if (shifting) {
          // treat the panorama's light as a blackbody at its reference temperature when shifting its colour
          const base = this.panoramaBase;
          colourAtIndex(colours, num[N_PANORAMA_INDEX] + shiftIndex, col);
          r0 += gain * s[0] * (base[0] > 0 ? col[0] / base[0] : 1);
          r1 += gain * s[1] * (base[1] > 0 ? col[1] / base[1] : 1);
          r2 += gain * s[2] * (base[2] > 0 ? col[2] / base[2] : 1);
        } else {
          r0 += gain * s[0];
          r1 += gain * s[1];
          r2 += gain * s[2];
        }
      }
    }
    if (flag[F_UNIFORM] === 1) {
      const brightness = num[N_UNIFORM_BRIGHTNESS];
      colourAtIndex(colours, num[N_UNIFORM_INDEX] + shiftIndex, col);
      r0 += brightness * col[0];
      r1 += brightness * col[1];
      r2 += brightness * col[2];
    }
    // Liouville: bolometric surface brightness scales as g^4 (physics.md section 6)
    const g2 = g * g;
    const beam = flag[F_BEAMING] === 1 ? g2 * g2 : 1;
    rad[0] = r0 * beam;
    rad[1] = r1 * beam;
    rad[2] = r2 * beam;
    return this.result;
  }
}

/**
 * Display-linear colour of a #rrggbb hex code (sRGB decoding, IEC 61966-2-1).
 * @param hex colour as #rrggbb
 * @returns linear r, g, b in 0..1
 */
export function hexToLinear(hex: string): Float64Array {
  if (!/^#[0-9a-fA-F]{6}$/.test(hex)) throw new RangeError('hex: a colour written #rrggbb');
  const out = new Float64Array(3);
  for (let k = 0; k < 3; k++) {
    const c = parseInt(hex.slice(1 + 2 * k, 3 + 2 * k), 16) / 255;
    out[k] = c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
  }
  return out;
}
