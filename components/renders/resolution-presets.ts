/**
 * Output sizes a producer picks from (product.md, Delivery formats): square
 * dome masters at 2048, 4096 (the common floor for touring shows) and 8192
 * (large domes); flat frames at the broadcast sizes (common practice).
 */
export type ProjectionKind = 'dome' | 'flat' | 'equirect' | 'cubeFace';
export type ResolutionPreset = { id: string; label: string; width: number; height: number; fits: readonly ProjectionKind[] };

const SQUARE: readonly ProjectionKind[] = ['dome', 'cubeFace'];

export const RESOLUTION_PRESETS: readonly ResolutionPreset[] = [
  { id: 'dome-2048', label: 'Dome master 2048 × 2048', width: 2048, height: 2048, fits: SQUARE },
  { id: 'dome-4096', label: 'Dome master 4096 × 4096 (touring floor)', width: 4096, height: 4096, fits: SQUARE },
  { id: 'dome-8192', label: 'Dome master 8192 × 8192 (large domes)', width: 8192, height: 8192, fits: SQUARE },
  { id: 'flat-720', label: 'Flat 1280 × 720', width: 1280, height: 720, fits: ['flat'] },
  { id: 'flat-1080', label: 'Flat 1920 × 1080', width: 1920, height: 1080, fits: ['flat'] },
  { id: 'flat-2160', label: 'Flat 3840 × 2160 (UHD)', width: 3840, height: 2160, fits: ['flat'] },
  { id: 'equirect-4096', label: 'Equirectangular 4096 × 2048', width: 4096, height: 2048, fits: ['equirect'] },
  { id: 'equirect-8192', label: 'Equirectangular 8192 × 4096', width: 8192, height: 4096, fits: ['equirect'] },
];

export const CUSTOM_PRESET_ID = 'custom';

/** Presets that suit a projection (dome masters and cube faces are square). */
export function presetsFor(kind: ProjectionKind | undefined): ResolutionPreset[] {
  return kind ? RESOLUTION_PRESETS.filter((p) => p.fits.includes(kind)) : [...RESOLUTION_PRESETS];
}
