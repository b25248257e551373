/**
 * Node-only loaders of the sky assets: the star catalogue and Milky Way map
 * converted at first use from d3-celestial's data files (copyright Olaf Frohn,
 * BSD-3-Clause) and cached as binaries under .data/cache; equirectangular
 * panoramas decoded with sharp. Each loader is memoised per process (and so per
 * worker thread).
 */
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { catalogueFromGeoJson, decodeCatalogue, encodeCatalogue, type StarCatalogue } from '../starCatalogue';
import { rasteriseMilkyWay } from '../milkyWay';
import type { PanoramaImage, SkyAssets } from '../frame';
import type { FrameRequest } from '../schema';
import { celestialDataDir, renderCacheDir } from './paths';

const MW_WIDTH = 1024;
const MW_HEIGHT = 512;
const MW_BLUR_DEG = 1.2;

/** Write a file atomically (temp file + rename) so parallel first uses never read half a cache file. */
function writeAtomic(file: string, bytes: Uint8Array): void {
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const tmp = `${file}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
  fs.writeFileSync(tmp, bytes);
  fs.renameSync(tmp, file);
}

/** Cache file name tied to the source file's size and modification time, so a package update re-converts. */
function cacheName(source: string, stem: string): string {
  const st = fs.statSync(source);
  return path.join(renderCacheDir(), `${stem}-${st.size}-${Math.floor(st.mtimeMs)}.bin`);
}

let catalogue: StarCatalogue | null = null;

/**
 * The d3-celestial stars.8.json catalogue (about 41,000 stars to magnitude 8), converted once and cached.
 * @returns the catalogue
 */
export function loadStarCatalogue(): StarCatalogue {
  if (catalogue) return catalogue;
  const source = path.join(celestialDataDir(), 'stars.8.json');
  const cached = cacheName(source, 'stars8');
  if (fs.existsSync(cached)) {
    catalogue = decodeCatalogue(new Uint8Array(fs.readFileSync(cached)));
  } else {
    catalogue = catalogueFromGeoJson(JSON.parse(fs.readFileSync(source, 'utf8')));
    writeAtomic(cached, encodeCatalogue(catalogue));
  }
  return catalogue;
}

let milkyWay: { width: number; height: number; data: Float32Array } | null = null;

/**
 * The Milky Way brightness map rasterised from d3-celestial's mw.json (1024 x 512), converted once and cached.
 * @returns map in mag-0 star fluxes per steradian
 */
export function loadMilkyWayMap(): { width: number; height: number; data: Float32Array } {
  if (milkyWay) return milkyWay;
  const source = path.join(celestialDataDir(), 'mw.json');
  const cached = cacheName(source, `milkyway-${MW_WIDTH}x${MW_HEIGHT}-${MW_BLUR_DEG}`);
  let data: Float32Array;
  if (fs.existsSync(cached)) {
    const bytes = fs.readFileSync(cached);
    data = new Float32Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength));
  } else {
    data = rasteriseMilkyWay(JSON.parse(fs.readFileSync(source, 'utf8')), MW_WIDTH, MW_HEIGHT, MW_BLUR_DEG);
    writeAtomic(cached, new Uint8Array(data.buffer, data.byteOffset, data.byteLength));
  }
  if (data.length !== MW_WIDTH * MW_HEIGHT) throw new RangeError(`milky way cache ${cached}: wrong size; delete it`);
  milkyWay = { width: MW_WIDTH, height: MW_HEIGHT, data };
  return milkyWay;
}

const panoramas = new Map<string, PanoramaImage>();

/**
 * Decode an equirectangular panorama (PNG, JPEG, TIFF, WebP...) into linear RGB floats.
 * The image's left edge is RA 0h and RA grows to the right; its top row is Dec +90.
 * @param source file path, or an in-memory encoded image
 * @param key cache key for buffers (file paths are their own key)
 * @returns linear RGB, sRGB-decoded (IEC 61966-2-1) for 8-bit and 16-bit inputs
 */
export async function loadPanorama(source: string | Buffer, key?: string): Promise<PanoramaImage> {
  const cacheKey = typeof source === 'string' ? source : key;
  if (cacheKey && panoramas.has(cacheKey)) return panoramas.get(cacheKey)!;
  const { data, info } = await sharp(source).removeAlpha().toColourspace('rgb16').raw({ depth: 'ushort' }).toBuffer({ resolveWithObject: true });
  const samples = new Uint16Array(data.buffer, data.byteOffset, data.byteLength / 2);
  const lut = new Float32Array(65536);
  for (let i = 0; i < 65536; i++) {
    const c = i / 65535;
    lut[i] = c <= 0.04045 ? c / 12.92 : Math.pow((c + 0.055) / 1.055, 2.4);
  }
  const rgb = new Float32Array(info.width * info.height * 3);
  for (let i = 0; i < rgb.length; i++) rgb[i] = lut[samples[i]];
  const image = { width: info.width, height: info.height, rgb };
  if (cacheKey) panoramas.set(cacheKey, image);
  return image;
}

/**
 * Load every asset a request needs.
 * @param req validated request
 * @param panoramaBuffer encoded panorama bytes when the request's panorama source is not a file path
 * @returns sky assets for prepareFrame
 */
export async function loadSkyAssets(req: FrameRequest, panoramaBuffer?: Buffer): Promise<SkyAssets> {
  const assets: SkyAssets = {};
  if (req.sky.stars.enabled) assets.catalogue = loadStarCatalogue();
  if (req.sky.milkyWay.enabled) assets.milkyWay = loadMilkyWayMap();
  if (req.sky.panorama) {
    assets.panorama = await loadPanorama(panoramaBuffer ?? req.sky.panorama.source, req.sky.panorama.source);
  }
  return assets;
}
