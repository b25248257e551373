/**
 * The sky-view page's settings and their translation into a lib/render frame
 * request. Radii are typed in Schwarzschild radii (r_s = 2M) as the interface
 * shows them (physics.md section 1); the request carries M units.
 */
import { parseFrameRequest, type FrameRequest } from '@/lib/render/schema';

export type ObserverKind = 'hover' | 'fall';
export type ProjectionKind = 'flat' | 'dome' | 'equirect' | 'cubeFace';
export type CubeFace = 'front' | 'back' | 'left' | 'right' | 'up' | 'down';
export type FrameSize = 'small' | 'medium' | 'large';

/** Frame sizes offered (16:9; square projections use the height). */
export const FRAME_SIZES: Record<FrameSize, { width: number; height: number; label: string }> = {
  small: { width: 320, height: 180, label: '320 × 180' },
  medium: { width: 640, height: 360, label: '640 × 360' },
  large: { width: 1280, height: 720, label: '1280 × 720' },
};

export interface ViewControls {
  radiusRs: number;
  observer: ObserverKind;
  /** -u_t of the fall; 1 is from rest at infinity */
  energy: number;
  /** look direction: turn from the hole towards the right (degrees) */
  yawDeg: number;
  /** look direction: above the hole's horizon plane towards the celestial north (degrees) */
  pitchDeg: number;
  projection: ProjectionKind;
  fovDeg: number;
  apertureDeg: number;
  tiltDeg: number;
  face: CubeFace;
  size: FrameSize;
  sources: boolean;
  grids: boolean;
}

export const DEFAULT_CONTROLS: ViewControls = {
  radiusRs: 3.5,
  observer: 'hover',
  energy: 1,
  yawDeg: 0,
  pitchDeg: 0,
  projection: 'flat',
  fovDeg: 90,
  apertureDeg: 180,
  tiltDeg: 0,
  face: 'front',
  size: 'medium',
  sources: false,
  grids: true,
};

const DEG = Math.PI / 180;

/** Result of {@link requestFromControls}: a request, or the reason there is none. */
export type ControlsResult = { ok: true; request: FrameRequest } | { ok: false; message: string };

/**
 * Frame request of the settings.
 * @param c the settings
 * @returns a validated request, or a message naming the setting to fix
 */
export function requestFromControls(c: ViewControls): ControlsResult {
  if (!(c.radiusRs > 0)) return { ok: false, message: 'Radius must be a positive number of Schwarzschild radii.' };
  const radiusM = 2 * c.radiusRs;
  if (c.observer === 'hover' && !(c.radiusRs > 1)) {
    return { ok: false, message: 'A hovering camera must stay outside the event horizon (radius above 1 r_s).' };
  }
  const minEnergy = Math.sqrt(Math.max(0, 1 - 2 / radiusM));
  if (c.observer === 'fall' && !(c.energy >= minEnergy && c.energy > 0)) {
    return { ok: false, message: `The fall's energy must be at least ${minEnergy.toFixed(4)} to reach ${c.radiusRs} r_s.` };
  }
  const size = FRAME_SIZES[c.size];
  const square = c.projection === 'dome' || c.projection === 'cubeFace';
  const yaw = c.yawDeg * DEG;
  const pitch = Math.max(-89.9, Math.min(89.9, c.pitchDeg)) * DEG;
  const grid = (colour: string, dashed: boolean) => ({ enabled: c.grids, spacingDeg: 15, lineWidthPx: 1, colour, dashed });
  try {
    const request = parseFrameRequest({
      camera: {
        state: c.observer === 'hover' ? { kind: 'hover', radiusM } : { kind: 'radial', radiusM, energy: c.energy },
        // camera frame: e1 away from the hole, e2 to the right when facing the hole with e3 up
        look: [-Math.cos(pitch) * Math.cos(yaw), Math.cos(pitch) * Math.sin(yaw), Math.sin(pitch)],
        up: [0, 0, 1],
      },
      projection:
        c.projection === 'flat'
          ? { kind: 'flat', fovDeg: c.fovDeg }
          : c.projection === 'dome'
            ? { kind: 'dome', apertureDeg: c.apertureDeg, tiltDeg: c.tiltDeg }
            : c.projection === 'equirect'
              ? { kind: 'equirect' }
              : { kind: 'cubeFace', face: c.face },
      width: square ? size.height : size.width,
      height: size.height,
      effects: { horizonGrid: grid('#2dd4bf', false), farSideGrid: grid('#a78bfa', true) },
    });
    return { ok: true, request };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}
