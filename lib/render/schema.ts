/**
 * The frame request: everything that decides the pixels of one rendered frame.
 * One zod schema, shared later by the API, the render queue and the CLI, so a
 * request stored with a frame is enough to reproduce its bytes.
 *
 * Frames used here:
 * - hole frame: fixed axes at the hole, aligned with the J2000 equatorial axes
 *   (x to RA 0h Dec 0, z to the north celestial pole), so sky directions are
 *   read straight off the star catalogue.
 * - camera frame: the observer's orthonormal frame (physics.md section 5):
 *   e1 radially outward, e3 towards the celestial north pole projected on the
 *   sky plane, e2 = e3 x e1. Look and up vectors are given in (e1, e2, e3).
 */
import { z } from 'zod';

/** Largest frame side in pixels (issue 4: "up to 8192 square"). */
export const MAX_FRAME_SIDE_PX = 8192;

const vector3 = z.tuple([z.number().finite(), z.number().finite(), z.number().finite()]);

/** Camera state: which observer sits where (physics.md section 3). Radii in M (horizon r = 2). */
export const cameraStateSchema = z.discriminatedUnion('kind', [
  z.object({
    /** Hovering (static) observer, thrusting to stay at fixed r > 2M. */
    kind: z.literal('hover'),
    radiusM: z.number().finite().gt(2).max(1e9),
  }),
  z.object({
    /** Radial geodesic with specific energy eps = -u_t, moving inward (or outward, r > 2M only). */
    kind: z.literal('radial'),
    radiusM: z.number().finite().gt(0).max(1e9),
    energy: z.number().finite().positive().max(1e3),
    direction: z.enum(['in', 'out']).default('in'),
  }),
  z.object({
    /** Any observer given by its constants of motion at r (orbits, falls with angular momentum, thrusted holds). */
    kind: z.literal('fourVelocity'),
    radiusM: z.number().finite().gt(0).max(1e9),
    /** Specific energy eps = -u_t. */
    energy: z.number().finite().min(-1e3).max(1e3),
    /** Specific angular momentum u_phi (M units); the camera moves along +e2 (see motionAngleDeg) when positive. */
    angularMomentum: z.number().finite().min(-1e4).max(1e4).default(0),
    /** Direction of the tangential motion on the camera's sky plane: angle from e2 towards e3, degrees. */
    motionAngleDeg: z.number().finite().min(-360).max(360).default(0),
    /** Sign of u^r: 'in' for falling, 'out' for rising (outside the horizon only). */
    direction: z.enum(['in', 'out']).default('in'),
  }),
  z.object({
    /** A sampled worldline point (lib/relativity sampleWorldline): state and camera axes in the hole frame. */
    kind: z.literal('sample'),
    radiusM: z.number().finite().gt(0).max(1e9),
    energy: z.number().finite().min(-1e3).max(1e3),
    angularMomentum: z.number().finite().min(-1e4).max(1e4),
    /** u^r of the camera (negative when falling). */
    ur: z.number().finite().min(-1e3).max(1e3),
    /** sample.radialAxis: unit vector from the hole to the camera, hole frame (J2000 axes). */
    radialAxis: vector3,
    /** sample.tangentAxis: unit vector of increasing orbital azimuth, hole frame. */
    tangentAxis: vector3,
  }),
]);

/** Projection of the camera sky onto the frame (physics.md section 7). */
export const projectionSchema = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('flat'), fovDeg: z.number().finite().gt(0).lt(180).default(60) }),
  z.object({
    kind: z.literal('dome'),
    apertureDeg: z.number().finite().min(180).max(230).default(180),
    tiltDeg: z.number().finite().min(-90).max(90).default(0),
  }),
  z.object({ kind: z.literal('equirect') }),
  z.object({ kind: z.literal('cubeFace'), face: z.enum(['front', 'back', 'left', 'right', 'up', 'down']) }),
]);

const hexColour = z.string().regex(/^#[0-9a-fA-F]{6}$/);

/** Latitude/longitude grid painted where backward rays reach r = 2M. */
const gridSchema = (colour: string, dashed: boolean) =>
  z.object({
    enabled: z.boolean().default(true),
    spacingDeg: z.number().finite().min(1).max(90).default(15),
    lineWidthPx: z.number().finite().min(0.25).max(8).default(1),
    colour: hexColour.default(colour),
    dashed: z.boolean().default(dashed),
  });

export const frameRequestSchema = z
  .object({
    /** Black-hole mass in solar masses; images are mass-independent in M units, kept for the record. */
    massSolar: z.number().finite().positive().max(1e12).default(4.1e6),
    camera: z.object({
      state: cameraStateSchema,
      /** Direction from the camera to the hole on the unlensed sky, J2000 degrees (default: the Galactic centre); unused for 'sample' states, which carry their axes. */
      holeDirection: z
        .object({
          raDeg: z.number().finite().min(0).max(360),
          decDeg: z.number().finite().min(-90).max(90),
        })
        .default({ raDeg: 266.405, decDeg: -28.936 }),
      /** Frame-centre direction in the camera frame (e1 outward, e2, e3); default: at the hole. */
      look: vector3.default([-1, 0, 0]),
      /** Direction towards the top of the frame, camera frame; made orthogonal to look. */
      up: vector3.default([0, 0, 1]),
      /** Extra rotation of the image about the look direction, degrees, positive turns up towards the right. */
      rollDeg: z.number().finite().min(-360).max(360).default(0),
    }),
    projection: projectionSchema,
    width: z.number().int().min(1).max(MAX_FRAME_SIDE_PX),
    height: z.number().int().min(1).max(MAX_FRAME_SIDE_PX),
    sky: z
      .object({
        stars: z
          .object({
            enabled: z.boolean().default(true),
            /** Faintest catalogue magnitude drawn (the catalogue stops near 8). */
            magnitudeLimit: z.number().finite().min(-2).max(8.5).default(8.5),
            /** Gaussian point-spread sigma in output pixels: >= 0.5 keeps stars from vanishing between pixels. */
            psfSigmaPx: z.number().finite().min(0.5).max(4).default(0.8),
            /** Angular size floor of a star on the sky (arcsec): bounds the brightness of an exact Einstein ring. */
            sourceSizeArcsec: z.number().finite().min(0.01).max(3600).default(5),
            gain: z.number().finite().min(0).max(1e6).default(1),
          })
          .default({ enabled: true, magnitudeLimit: 8.5, psfSigmaPx: 0.8, sourceSizeArcsec: 5, gain: 1 }),
        milkyWay: z
          .object({ enabled: z.boolean().default(true), gain: z.number().finite().min(0).max(1e6).default(1) })
          .default({ enabled: true, gain: 1 }),
        panorama: z
          .object({
            /** Asset key or file path of an equirectangular image (left edge RA 0h, RA growing to the right, top row Dec +90; see README). */
            source: z.string().min(1),
            /** Surface brightness of a linear value 1 in the panorama, mag-0 star fluxes per steradian. */
            gain: z.number().finite().min(0).max(1e9).default(1000),
            /** Colour temperature the panorama's light is taken to have when shifted (K). */
            referenceTemperatureK: z.number().finite().min(1000).max(1e5).default(6500),
          })
          .optional(),
        /** A uniform sky of this surface brightness (mag-0 fluxes per steradian, at 6500 K); for tests and calibration. */
        uniform: z
          .object({ brightness: z.number().finite().min(0).max(1e12), temperatureK: z.number().finite().min(1000).max(1e5).default(6500) })
          .optional(),
      })
      .default({
        stars: { enabled: true, magnitudeLimit: 8.5, psfSigmaPx: 0.8, sourceSizeArcsec: 5, gain: 1 },
        milkyWay: { enabled: true, gain: 1 },
      }),
    /** Effects that may be switched off for artistic reasons; each one off is listed in the accuracy report. */
    effects: z
      .object({
        lensing: z.boolean().default(true),
        colourShift: z.boolean().default(true),
        beaming: z.boolean().default(true),
        horizonGrid: gridSchema('#2dd4bf', false).default({ enabled: true, spacingDeg: 15, lineWidthPx: 1, colour: '#2dd4bf', dashed: false }),
        farSideGrid: gridSchema('#a78bfa', true).default({ enabled: true, spacingDeg: 15, lineWidthPx: 1, colour: '#a78bfa', dashed: true }),
      })
      .default({
        lensing: true,
        colourShift: true,
        beaming: true,
        horizonGrid: { enabled: true, spacingDeg: 15, lineWidthPx: 1, colour: '#2dd4bf', dashed: false },
        farSideGrid: { enabled: true, spacingDeg: 15, lineWidthPx: 1, colour: '#a78bfa', dashed: true },
      }),
    exposure: z
      .object({
        /** Stops: linear scale 2^ev * 1e-3 (ev 0 maps 1000 mag-0 fluxes per steradian to display 1). */
        ev: z.number().finite().min(-60).max(60).default(0),
        toneMap: z.enum(['none', 'reinhard', 'exponential']).default('exponential'),
      })
      .default({ ev: 0, toneMap: 'exponential' }),
    /** Samples per pixel along each axis (n x n box filter). */
    supersampling: z.number().int().min(1).max(4).default(1),
    output: z
      .object({ format: z.enum(['png8', 'png16', 'jpeg']).default('png8'), jpegQuality: z.number().int().min(1).max(100).default(92) })
      .default({ format: 'png8', jpegQuality: 92 }),
  })
  .superRefine((req, ctx) => {
    if (req.projection.kind === 'dome' || req.projection.kind === 'cubeFace') {
      if (req.width !== req.height) {
        ctx.addIssue({ code: 'custom', path: ['height'], message: `${req.projection.kind} frames are square: height must equal width` });
      }
    }
  });

/** A validated frame request with every default filled in. */
export type FrameRequest = z.output<typeof frameRequestSchema>;
/** A frame request as written by hand (defaults optional). */
export type FrameRequestInput = z.input<typeof frameRequestSchema>;
export type CameraState = z.output<typeof cameraStateSchema>;
export type Projection = z.output<typeof projectionSchema>;

/**
 * Parse and validate a frame request.
 * @param input untyped JSON (e.g. read from a request file)
 * @returns the request with defaults filled in
 * @throws RangeError naming the first invalid field and its allowed range
 */
export function parseFrameRequest(input: unknown): FrameRequest {
  const result = frameRequestSchema.safeParse(input);
  if (!result.success) {
    const issue = result.error.issues[0];
    throw new RangeError(`frame request: ${issue.path.join('.') || '(root)'}: ${issue.message}`);
  }
  return result.data;
}

/**
 * The non-physical choices a request makes (effects off, overlays, tone mapping),
 * for the accuracy report (physics.md section 6, last point).
 * @param req validated request
 * @returns human-readable lines, empty only if nothing departs from the physics
 */
export function listNonPhysicalChoices(req: FrameRequest): string[] {
  const out: string[] = [];
  if (!req.effects.lensing) out.push('lensing switched off (plain sky remap)');
  if (!req.effects.colourShift) out.push('frequency-shift colours switched off');
  if (!req.effects.beaming) out.push('g^4 brightness scaling switched off');
  if (req.effects.horizonGrid.enabled) out.push('horizon grid overlay');
  if (req.effects.farSideGrid.enabled) out.push('far-side grid overlay');
  if (!req.sky.milkyWay.enabled) out.push('Milky Way switched off');
  if (!req.sky.stars.enabled) out.push('stars switched off');
  if (req.sky.milkyWay.gain !== 1) out.push(`Milky Way gain ${req.sky.milkyWay.gain}`);
  if (req.sky.stars.gain !== 1) out.push(`star gain ${req.sky.stars.gain}`);
  out.push(`exposure ${req.exposure.ev} EV, tone mapping ${req.exposure.toneMap}`);
  out.push(`star point-spread sigma ${req.sky.stars.psfSigmaPx} px`);
  return out;
}
