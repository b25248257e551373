/**
 * Sky data for the GPU path, built once per set of assets and star magnitude
 * limit from lib/webgl (CPU-side preparation; no WebGL here).
 */
import type { StarCatalogue } from '@/lib/render/starCatalogue';
import { buildColourTexture, buildDiffuseTextures, buildStarTextures, type ColourTexture, type DiffuseTextures, type StarTextures } from '@/lib/webgl/skyTextures';
import type { BrightnessMap } from '@/lib/webgl/skyAssetFormat';
import { loadSkyAssets } from '../sky-assets';

/** Everything the GPU needs about the sky. */
export interface GpuSkyData {
  stars: StarTextures | null;
  diffuse: DiffuseTextures | null;
  colour: ColourTexture;
  hasMilkyWay: boolean;
  magnitudeLimit: number;
}

/** Build the GPU sky data from decoded assets. */
export function buildGpuSkyData(catalogue: StarCatalogue | null, milkyWay: BrightnessMap | null, magnitudeLimit: number): GpuSkyData {
  const stars = catalogue ? buildStarTextures(catalogue, magnitudeLimit) : null;
  const diffuse = milkyWay || stars ? buildDiffuseTextures(milkyWay, stars) : null;
  return { stars, diffuse, colour: buildColourTexture(), hasMilkyWay: !!milkyWay, magnitudeLimit };
}

/**
 * Fetch the sky assets and build the GPU sky data (what the sky-data worker runs, and the page when no worker can).
 * @param base absolute sky-assets URL
 * @param limit faintest star magnitude drawn
 */
export async function loadAndBuildGpuSkyData(base: string, limit: number): Promise<GpuSkyData> {
  const assets = await loadSkyAssets(base);
  return buildGpuSkyData(assets.catalogue, assets.milkyWay, limit);
}
