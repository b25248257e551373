/**
 * The one schema for a scene revision's content, shared by the editor's
 * forms, the API and the renderer. Radii and proper times are in units of the
 * hole's mass M (geometric units, physics.md section 1); the editor shows
 * Schwarzschild radii (r_s = 2 M) and SI seconds for the scene's mass.
 */
import { z } from 'zod';
import { validateWorldline, type WorldlineSpec } from '@/lib/relativity';
import { frameRequestSchema, projectionSchema } from '@/lib/render/schema';

const finite = (field: string) => z.number({ error: `${field} must be a number` }).finite(`${field} must be a finite number`);
const unitVector = z.tuple([finite('x'), finite('y'), finite('z')]);
const duration = finite('duration').positive('duration must be a positive proper time (M)');
/** A fall may instead end where it first reaches a radius (M); the engine checks it is reached. */
const untilR = finite('untilR').positive('the radius to reach must be positive (M)');

const HORIZON = 'outside the event horizon: r > 2 M (1 r_s)';
const hoverRadius = finite('r').gt(2, `a hover must be ${HORIZON}`);
const startRadius = finite('r').gt(2, `a free-fall segment starts ${HORIZON}`);

export const segmentSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('hover'), r: hoverRadius.optional(), duration }),
  z.strictObject({
    kind: z.literal('circular-orbit'),
    r: finite('r').gt(3, 'a circular orbit must lie outside the photon sphere: r > 3 M (1.5 r_s)').optional(),
    duration,
    sense: z.union([z.literal(1), z.literal(-1)]).optional(),
  }),
  z.strictObject({ kind: z.literal('drop'), r: startRadius.optional(), duration: duration.optional(), untilR: untilR.optional() }),
  z.strictObject({
    kind: z.literal('fall'),
    r: startRadius.optional(),
    speed: finite('speed').min(0, 'speed must be zero or more').lt(1, 'speed must be below the speed of light (< 1 c)'),
    duration: duration.optional(),
    untilR: untilR.optional(),
  }),
  z.strictObject({
    kind: z.literal('free-fall'),
    r: finite('r').gt(0, 'r must be positive').optional(),
    energy: finite('energy').positive('energy (-u_t) must be positive'),
    angularMomentum: finite('angularMomentum'),
    radialSense: z.enum(['in', 'out']),
    duration: duration.optional(),
    untilR: untilR.optional(),
  }),
  z.strictObject({
    kind: z.literal('hold'),
    duration,
    orbitalSpeed: finite('orbitalSpeed').gt(-1, 'orbital speed must be below the speed of light').lt(1, 'orbital speed must be below the speed of light (< 1 c)').optional(),
  }),
], { error: 'kind must be one of hover, circular-orbit, drop, fall, free-fall, hold' });

export const lookKeyframeSchema = z.strictObject({
  /** Proper time along the path (M) at which this keyframe applies. */
  tau: finite('tau').min(0, 'tau must be zero or more'),
  /** Frame-centre direction in the camera frame (e1 outward, e2 along the motion, e3 normal). */
  look: unitVector,
  up: unitVector,
  fovDeg: finite('fovDeg').gt(1, 'field of view must be more than 1 degree').lt(179, 'field of view must be less than 179 degrees'),
  rollDeg: finite('rollDeg').min(-360).max(360).default(0),
});

export const FRAME_RATES = [24, 25, 29.97, 30, 60] as const;

export const pacingSchema = z
  .strictObject({
    frameRate: finite('frameRate').refine((rate) => (FRAME_RATES as readonly number[]).includes(rate), `frameRate must be one of ${FRAME_RATES.join(', ')} frames per second`),
    /** Screen time (s) against proper time (M): the pacing curve's handles, both increasing. */
    points: z.array(z.strictObject({ properTime: finite('properTime').min(0), screenTime: finite('screenTime').min(0) })).min(2, 'the pacing curve needs at least two points'),
  })
  .superRefine((pacing, ctx) => {
    for (let i = 1; i < pacing.points.length; i++) {
      const a = pacing.points[i - 1];
      const b = pacing.points[i];
      if (!(b.properTime > a.properTime)) ctx.addIssue({ code: 'custom', path: ['points', i, 'properTime'], message: 'proper times must increase along the pacing curve' });
      if (!(b.screenTime > a.screenTime)) ctx.addIssue({ code: 'custom', path: ['points', i, 'screenTime'], message: 'screen times must increase along the pacing curve' });
    }
  });

const frameShape = frameRequestSchema.shape;

export const sceneSpecSchema = z
  .strictObject({
    massSolar: finite('massSolar').gt(0, 'mass must be greater than zero solar masses').max(1e11, 'mass must be at most 1e11 solar masses'),
    path: z.strictObject({
      startDirection: unitVector.optional(),
      motionDirection: unitVector.optional(),
      segments: z.array(segmentSchema).min(1, 'a camera path needs at least one segment').max(50, 'a camera path has at most 50 segments'),
    }),
    look: z.strictObject({ keyframes: z.array(lookKeyframeSchema).min(1, 'add at least one look keyframe').max(200) }),
    projection: projectionSchema,
    sky: frameShape.sky,
    effects: frameShape.effects,
    exposure: frameShape.exposure,
    pacing: pacingSchema,
    notes: z.string().max(10_000, 'notes must be at most 10 000 characters').default(''),
  })
  .superRefine((spec, ctx) => {
    if (spec.path.segments[0] && spec.path.segments[0].kind !== 'hold' && spec.path.segments[0].r === undefined) {
      ctx.addIssue({ code: 'custom', path: ['path', 'segments', 0, 'r'], message: 'the first segment needs a starting radius r' });
      return;
    }
    // The engine's own checks: chains that cannot happen (e.g. a segment starting where the previous cannot reach).
    for (const issue of validateWorldline(toWorldlineSpec(spec))) {
      ctx.addIssue({ code: 'custom', path: ['path', ...parseIssuePath(issue.path)], message: issue.message });
    }
  });

export type SceneSpec = z.output<typeof sceneSpecSchema>;
export type SceneSpecInput = z.input<typeof sceneSpecSchema>;
export type SegmentSpec = z.output<typeof segmentSchema>;

/** The camera path in the engine's own form. */
export function toWorldlineSpec(spec: Pick<SceneSpec, 'massSolar' | 'path'>): WorldlineSpec {
  return { massSolar: spec.massSolar, startDirection: spec.path.startDirection, motionDirection: spec.path.motionDirection, segments: spec.path.segments };
}

/** "segments[2].r" -> ['segments', 2, 'r'] */
function parseIssuePath(path: string): (string | number)[] {
  return path
    .split(/[.[\]]/)
    .filter(Boolean)
    .map((p) => (/^\d+$/.test(p) ? Number(p) : p));
}
