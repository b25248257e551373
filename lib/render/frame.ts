/**
 * Frame plan: everything computed once per frame (projection, orientation,
 * the lensing table, colour table, star field and sky maps), so the per-pixel
 * path only reads typed arrays. The plan is built from a request, the sky
 * assets and (optionally) a lensing table computed elsewhere, so worker
 * threads can share one table per frame.
 */
import type { FrameRequest } from './schema';
import { createProjector, type Projector } from './projections';
import { cameraToHoleFromAxes, cameraToHoleMatrix, multiplyMat3, viewToCameraMatrix, type Mat3 } from './orientation';
import { buildColourTable, type ColourTable } from './colourTable';
import { buildStarField, depositStarLight, type StarField } from './starField';
import { buildSkyMipMap, type SkyMipMap } from './skyMap';
import type { StarCatalogue } from './starCatalogue';
import {
  engineBlackbodyLinearSrgb,
  engineCameraOptics,
  engineRayTable,
  engineRayTableArrays,
  engineTemperatureFromBv,
  type CameraOptics,
  type RayTableArrays,
} from './engine';
import { exposureScale } from './toneMap';
import { buildLensLut, type LensLut } from './lensLut';

/** Equirectangular panorama in linear RGB (layout of milkyWay.ts: RA 0 at the left edge, Dec +90 at the top). */
export interface PanoramaImage {
  width: number;
  height: number;
  /** linear RGB floats, 3 per texel */
  rgb: Float32Array;
}

/** Sky inputs a frame may use; the Node loaders in lib/render/node fill them from files. */
export interface SkyAssets {
  catalogue?: StarCatalogue;
  /** Milky Way surface brightness map (rasteriseMilkyWay output) */
  milkyWay?: { width: number; height: number; data: Float32Array };
  panorama?: PanoramaImage;
}

/** Everything the per-pixel path needs for one frame. */
export interface FramePlan {
  req: FrameRequest;
  projector: Projector;
  /** view space -> hole frame (J2000) */
  viewToHole: Mat3;
  /** view space -> camera frame */
  viewToCamera: Mat3;
  /** camera frame -> hole frame */
  cameraToHole: Mat3;
  /** the engine's ray table over psi behind a fast uniform grid; null when lensing is switched off */
  lens: LensLut | null;
  optics: CameraOptics;
  colours: ColourTable;
  stars: StarField | null;
  /** 3 channels: Milky Way brightness, star flux per sr, star flux * K per sr (all per steradian) */
  diffuse: SkyMipMap | null;
  panorama: SkyMipMap | null;
  exposure: number;
}

/** Width and height of the star-light map; one texel is about 0.35 degrees. */
const STAR_LIGHT_MAP_WIDTH = 1024;
const STAR_LIGHT_MAP_HEIGHT = 512;

/**
 * Compute the lensing table of a request's camera (the one per-frame table the workers share).
 * @param req validated request
 * @returns the table, or null when lensing is switched off
 */
export function computeLensTable(req: FrameRequest): RayTableArrays | null {
  if (!req.effects.lensing) return null;
  return engineRayTableArrays(engineCameraOptics(req.camera.state));
}

const colourCache: { table: ColourTable | null } = { table: null };
/** Star fields per catalogue object and magnitude limit (workers keep one catalogue object per asset key). */
const starCache = new WeakMap<StarCatalogue, Map<number, { field: StarField; light: Float32Array }>>();
const mipCache = new WeakMap<object, Map<string, SkyMipMap>>();

function cachedMip(key: object, sub: string, make: () => SkyMipMap): SkyMipMap {
  let m = mipCache.get(key);
  if (!m) mipCache.set(key, (m = new Map()));
  let v = m.get(sub);
  if (!v) m.set(sub, (v = make()));
  return v;
}

/**
 * Build the plan of a frame.
 * @param req validated request
 * @param assets sky inputs (catalogue, Milky Way map, panorama); a source the request enables must be present
 * @param lens precomputed lensing table (from computeLensTable), or undefined to compute it here
 * @returns the plan
 * @throws RangeError when an enabled sky source has no asset
 */
export function prepareFrame(req: FrameRequest, assets: SkyAssets, lens?: RayTableArrays | null): FramePlan {
  const projector = createProjector(req.projection, req.width, req.height);
  const viewToCamera = viewToCameraMatrix(req);
  const state = req.camera.state;
  const cameraToHole =
    state.kind === 'sample'
      ? cameraToHoleFromAxes(state.radialAxis, state.tangentAxis)
      : cameraToHoleMatrix(req.camera.holeDirection.raDeg, req.camera.holeDirection.decDeg);
  const optics = engineCameraOptics(req.camera.state);
  const tableArrays = lens === undefined ? computeLensTable(req) : lens;
  const colours = (colourCache.table ??= buildColourTable(engineBlackbodyLinearSrgb));

  let stars: StarField | null = null;
  let light: Float32Array | null = null;
  if (req.sky.stars.enabled) {
    if (!assets.catalogue) throw new RangeError('assets.catalogue: required when sky.stars.enabled is true');
    const limit = req.sky.stars.magnitudeLimit;
    let perCatalogue = starCache.get(assets.catalogue);
    if (!perCatalogue) starCache.set(assets.catalogue, (perCatalogue = new Map()));
    let entry = perCatalogue.get(limit);
    if (!entry) {
      const field = buildStarField(assets.catalogue, limit, engineTemperatureFromBv);
      entry = { field, light: depositStarLight(field, STAR_LIGHT_MAP_WIDTH, STAR_LIGHT_MAP_HEIGHT) };
      perCatalogue.set(limit, entry);
    }
    stars = entry.field;
    light = entry.light;
  }
  const mw = req.sky.milkyWay.enabled ? assets.milkyWay : undefined;
  if (req.sky.milkyWay.enabled && !mw) throw new RangeError('assets.milkyWay: required when sky.milkyWay.enabled is true');

  let diffuse: SkyMipMap | null = null;
  if (mw || light) {
    // keyed on the star-light array (one per catalogue and limit) or, without stars, on the Milky Way map
    const cacheKey = (light ?? mw!.data) as object;
    diffuse = cachedMip(cacheKey, `mw:${mw ? 1 : 0}`, () => {
      const w = STAR_LIGHT_MAP_WIDTH;
      const h = STAR_LIGHT_MAP_HEIGHT;
      if (mw && (mw.width !== w || mw.height !== h)) throw new RangeError(`assets.milkyWay: must be ${w} x ${h} texels`);
      const data = new Float32Array(w * h * 3);
      for (let i = 0; i < w * h; i++) {
        data[3 * i] = mw ? mw.data[i] : 0;
        data[3 * i + 1] = light ? light[2 * i] : 0;
        data[3 * i + 2] = light ? light[2 * i + 1] : 0;
      }
      return buildSkyMipMap(data, w, h, 3);
    });
  }
  let panorama: SkyMipMap | null = null;
  if (req.sky.panorama) {
    const p = assets.panorama;
    if (!p) throw new RangeError('assets.panorama: required when sky.panorama is set');
    panorama = cachedMip(p.rgb, 'pano', () => buildSkyMipMap(p.rgb, p.width, p.height, 3));
  }
  return {
    req,
    projector,
    viewToCamera,
    cameraToHole,
    viewToHole: multiplyMat3(cameraToHole, viewToCamera),
    lens: tableArrays ? buildLensLut(engineRayTable(tableArrays), optics.eps, optics.ur) : null,
    optics,
    colours,
    stars,
    diffuse,
    panorama,
    exposure: exposureScale(req.exposure.ev),
  };
}
