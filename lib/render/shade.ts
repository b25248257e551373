/**
 * The per-pixel path: view direction -> camera-frame look angle -> lensing
 * table -> sky direction, shift g and footprint -> radiance of stars, Milky
 * Way, panorama, or a grid where the ray ends on the horizon. Allocation-free:
 * one Shader per thread holds all scratch arrays.
 *
 * Radiance unit: mag-0 star fluxes per steradian. A star of flux F adds
 * F * K(d) with K a normalised Gaussian on the sky whose width is the pixel's
 * footprint on the sky times the point-spread sigma; since a screen area
 * dOmega_screen covers J^-1 of it on the sky, the image's total flux is
 * F * g^4 * J (physics.md section 6) and every image of a star (primary,
 * secondary, rings) appears wherever the lensing map sends pixels to it.
 */
import type { FramePlan } from './frame';
import { FATE_FAR_SIDE, FATE_HORIZON, FATE_SKY, createRayLookup } from '../relativity';
import { lookupLensLut } from './lensLut';
import { blackbodyColour, blackbodyColourLog } from './colourTable';
import { STAR_CELL_SIZE } from './starField';
import { sampleSkyMap } from './skyMap';
import { MILKY_WAY_TEMPERATURE_K } from './milkyWay';
import { drawGrid } from './grids';

/** Largest star kernel sigma (radians) summed star by star; wider footprints read the star-light map. */
const STAR_SIGMA_MAX_RAD = STAR_CELL_SIZE / 3;
const CELLS = Math.ceil(2 / STAR_CELL_SIZE) + 1;
const ARCSEC_RAD = Math.PI / 648000;
const LOG_MILKY_WAY_TEMPERATURE = Math.log(MILKY_WAY_TEMPERATURE_K);

/** Per-sample result: radiance and overlay. */
export interface SampleResult {
  /** radiance r, g, b (mag-0 fluxes per sr, linear sRGB primaries) */
  radiance: Float64Array;
  /** overlay colour (display-linear) premultiplied by coverage, then coverage */
  overlay: Float64Array;
}

/** Per-thread shading state for one frame plan. */
export class Shader {
  private readonly view = new Float64Array(3);
  private readonly cam = new Float64Array(3);
  private readonly dir = new Float64Array(3);
  private readonly colour = new Float64Array(3);
  private readonly mapSample = new Float64Array(3);
  private readonly lens = createRayLookup();
  readonly result: SampleResult = { radiance: new Float64Array(3), overlay: new Float64Array(4) };
  private readonly sourceSizeRad: number;
  private readonly horizonColour: Float64Array;
  private readonly farSideColour: Float64Array;

  constructor(private readonly plan: FramePlan) {
    this.sourceSizeRad = plan.req.sky.stars.sourceSizeArcsec * ARCSEC_RAD;
    this.horizonColour = hexToLinear(plan.req.effects.horizonGrid.colour);
    this.farSideColour = hexToLinear(plan.req.effects.farSideGrid.colour);
  }

  /**
   * Shade one sample point of the frame.
   * @param px frame x in pixels from the left edge
   * @param py frame y in pixels from the top edge
   * @param samplesPerAxis supersampling factor n (the sample spacing is 1/n px)
   * @returns the shared result record (overwritten by the next call)
   */
  shade(px: number, py: number, samplesPerAxis: number): SampleResult {
    const plan = this.plan;
    const req = plan.req;
    const rad = this.result.radiance;
    const ov = this.result.overlay;
    rad[0] = rad[1] = rad[2] = 0;
    ov[0] = ov[1] = ov[2] = ov[3] = 0;
    const pixelRad = plan.projector.pixelToView(this.view, px, py);
    if (pixelRad < 0) return this.result;
    const v = this.view;
    const m = plan.viewToCamera;
    // camera-frame look direction n (e1 outward radial)
    let n1 = m[0] * v[0] + m[1] * v[1] + m[2] * v[2];
    let n2 = m[3] * v[0] + m[4] * v[1] + m[5] * v[2];
    let n3 = m[6] * v[0] + m[7] * v[1] + m[8] * v[2];
    let doppler = 1;
    const optics = plan.optics;
    if (optics.boost && req.effects.lensing) {
      const c = this.cam;
      doppler = optics.boost(c, n1, n2, n3);
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
    const ls = this.lens;
    if (plan.lens) {
      lookupLensLut(plan.lens, psi, n1, ls);
    } else {
      ls.fate = FATE_SKY;
      ls.phi = psi;
      ls.g = 1;
      ls.dPhiDPsi = 1;
    }
    const g = ls.g * doppler;
    // sky (or horizon) direction: rotate e1 by phi towards the look direction's transverse part
    const cp = Math.cos(ls.phi);
    const sp = Math.sin(ls.phi);
    const c2h = plan.cameraToHole;
    const a2 = sp * t2;
    const a3 = sp * t3;
    const d = this.dir;
    d[0] = c2h[0] * cp + c2h[1] * a2 + c2h[2] * a3;
    d[1] = c2h[3] * cp + c2h[4] * a2 + c2h[5] * a3;
    d[2] = c2h[6] * cp + c2h[7] * a2 + c2h[8] * a3;
    // sky angle per screen angle: radial |dphi/dpsi|, tangential |sin phi| / sin psi
    const radial = Math.abs(ls.dPhiDPsi);
    const tangential = sinPsi > 1e-9 ? Math.abs(sp) / sinPsi : radial;
    const stretch = radial > tangential ? radial : tangential;
    const footRad = pixelRad * stretch;

    if (ls.fate === FATE_HORIZON || ls.fate === FATE_FAR_SIDE) {
      const grid = ls.fate === FATE_HORIZON ? req.effects.horizonGrid : req.effects.farSideGrid;
      if (grid.enabled) {
        const cover = drawGrid(d, footRad, grid.spacingDeg, grid.lineWidthPx, grid.dashed);
        const col = ls.fate === FATE_HORIZON ? this.horizonColour : this.farSideColour;
        ov[0] = col[0] * cover;
        ov[1] = col[1] * cover;
        ov[2] = col[2] * cover;
        ov[3] = cover;
      }
      return this.result;
    }

    const shift = req.effects.colourShift ? g : 1;
    const logShift = shift === 1 ? 0 : Math.log(shift);
    const beam = req.effects.beaming ? g * g * g * g : 1;
    const colours = plan.colours;
    const col = this.colour;
    const sampleFoot = footRad / samplesPerAxis;

    // stars, one by one while the kernel is narrow
    const sky = req.sky;
    const starSigma = Math.max(sky.stars.psfSigmaPx * footRad, this.sourceSizeRad);
    let mapWeight = 0;
    if (plan.stars) {
      mapWeight = smoothstep(0.5 * STAR_SIGMA_MAX_RAD, STAR_SIGMA_MAX_RAD, starSigma);
      if (mapWeight < 1) {
        const field = plan.stars;
        const reach = 3 * starSigma;
        const reach2 = reach * reach;
        const inv2s2 = 1 / (2 * starSigma * starSigma);
        const norm = (sky.stars.gain * (1 - mapWeight)) / (2 * Math.PI * starSigma * starSigma);
        const dx = d[0];
        const dy = d[1];
        const dz = d[2];
        const x0 = Math.floor((dx - reach + 1) / STAR_CELL_SIZE);
        const x1 = Math.floor((dx + reach + 1) / STAR_CELL_SIZE);
        const y0 = Math.floor((dy - reach + 1) / STAR_CELL_SIZE);
        const y1 = Math.floor((dy + reach + 1) / STAR_CELL_SIZE);
        const z0 = Math.max(0, Math.floor((dz - reach + 1) / STAR_CELL_SIZE));
        const z1 = Math.min(CELLS - 1, Math.floor((dz + reach + 1) / STAR_CELL_SIZE));
        const start = field.cellStart;
        for (let ix = x0 < 0 ? 0 : x0; ix <= x1 && ix < CELLS; ix++) {
          for (let iy = y0 < 0 ? 0 : y0; iy <= y1 && iy < CELLS; iy++) {
            const base = (ix * CELLS + iy) * CELLS;
            const end = start[base + z1 + 1];
            for (let s = start[base + z0]; s < end; s++) {
              const ex = field.x[s] - dx;
              const ey = field.y[s] - dy;
              const ez = field.z[s] - dz;
              const dist2 = ex * ex + ey * ey + ez * ez;
              if (dist2 >= reach2) continue;
              const w = norm * field.flux[s] * Math.exp(-dist2 * inv2s2);
              blackbodyColourLog(colours, field.logTemperature[s] + logShift, col);
              rad[0] += w * col[0];
              rad[1] += w * col[1];
              rad[2] += w * col[2];
            }
          }
        }
      }
    }

    const needsUv = plan.diffuse !== null || plan.panorama !== null;
    if (needsUv) {
      let u = Math.atan2(d[1], d[0]) / (2 * Math.PI);
      if (u < 0) u += 1;
      const vv = 0.5 - Math.asin(d[2] > 1 ? 1 : d[2] < -1 ? -1 : d[2]) / Math.PI;
      if (plan.diffuse) {
        const s = sampleSkyMap(plan.diffuse, u, vv, sampleFoot, this.mapSample);
        const mw = s[0] * sky.milkyWay.gain;
        if (mw > 0 && sky.milkyWay.enabled) {
          blackbodyColourLog(colours, LOG_MILKY_WAY_TEMPERATURE + logShift, col);
          rad[0] += mw * col[0];
          rad[1] += mw * col[1];
          rad[2] += mw * col[2];
        }
        if (mapWeight > 0 && s[1] > 0) {
          const flux = s[1] * sky.stars.gain * mapWeight;
          blackbodyColour(colours, (s[2] / s[1]) * shift, col);
          rad[0] += flux * col[0];
          rad[1] += flux * col[1];
          rad[2] += flux * col[2];
        }
      }
      if (plan.panorama && sky.panorama) {
        const s = sampleSkyMap(plan.panorama, u, vv, sampleFoot, this.mapSample);
        const gain = sky.panorama.gain;
        const tRef = sky.panorama.referenceTemperatureK;
        if (shift !== 1) {
          // treat the panorama's light as a blackbody at tRef when shifting its colour
          blackbodyColour(colours, tRef, col);
          const r0 = col[0];
          const g0 = col[1];
          const b0 = col[2];
          blackbodyColour(colours, tRef * shift, col);
          rad[0] += gain * s[0] * (r0 > 0 ? col[0] / r0 : 1);
          rad[1] += gain * s[1] * (g0 > 0 ? col[1] / g0 : 1);
          rad[2] += gain * s[2] * (b0 > 0 ? col[2] / b0 : 1);
        } else {
          rad[0] += gain * s[0];
          rad[1] += gain * s[1];
          rad[2] += gain * s[2];
        }
      }
    }
    if (sky.uniform) {
      blackbodyColour(colours, sky.uniform.temperatureK * shift, col);
      rad[0] += sky.uniform.brightness * col[0];
      rad[1] += sky.uniform.brightness * col[1];
      rad[2] += sky.uniform.brightness * col[2];
    }
    rad[0] *= beam;
    rad[1] *= beam;
    rad[2] *= beam;
    return this.result;
  }
}

function smoothstep(a: number, b: number, x: number): number {
  if (x <= a) return 0;
  if (x >= b) return 1;
  const t = (x - a) / (b - a);
  return t * t * (3 - 2 * t);
}

/**
 * Display-linear colour of a #rrggbb hex code (sRGB decoding, IEC 61966-2-1).
 * @param hex colour as #rrggbb
 * @returns linear r, g, b in 0..1
 */
export function hexToLinear(hex: string): Float64Array {
  const out = new Float64Array(3);
  for (let k = 0; k < 3; k++) {
    const c = parseInt(hex.slice(1 + 2 * k, 3 + 2 * k), 16) / 255;
    out[k] = c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
  }
  return out;
}
