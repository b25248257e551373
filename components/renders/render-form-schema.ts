/**
 * The New render form's values, their checks (with messages a producer can
 * act on) and the API request they become (lib/renders/service.ts,
 * renderRequestSchema). Frame limits come from the chosen revision.
 */
import { z } from 'zod';
import type { SceneFrames } from './frame-timing';
import { CUSTOM_PRESET_ID, type ProjectionKind } from './resolution-presets';

export const FORMATS = [
  { value: 'png8', label: '8-bit PNG master' },
  { value: 'png16', label: '16-bit PNG master' },
  { value: 'jpeg', label: 'JPEG proxy' },
] as const;

/** Smallest side the API accepts (lib/renders/settings.ts). */
const MIN_SIDE_PX = 16;
/** Largest side the API accepts by default (RENDER_MAX_SIDE_PX); the server has the last word. */
const MAX_SIDE_PX = 8192;

const wholeNumber = (text: string) => /^\s*\d+\s*$/.test(text);

export type RenderFormValues = {
  showId: string;
  sceneId: string;
  revision: string;
  kind: 'still' | 'sequence';
  stillBy: 'frame' | 'properTime';
  frame: string;
  properTimeSeconds: string;
  range: 'whole' | 'range';
  start: string;
  end: string;
  preset: string;
  width: string;
  height: string;
  format: 'png8' | 'png16' | 'jpeg';
  supersampling: string;
};

/**
 * The form's schema; `frames()` and `projection()` read the chosen revision at validation time.
 * @param frames the revision's frame bookkeeping, or null while it loads
 * @param projection the revision's projection kind (square sizes for dome masters and cube faces)
 */
export function renderFormSchema(frames: () => SceneFrames | null, projection: () => ProjectionKind | undefined) {
  return z
    .object({
      showId: z.string().min(1, 'Choose a show.'),
      sceneId: z.string().min(1, 'Choose a scene.'),
      revision: z.string().min(1, 'Choose a revision.'),
      kind: z.enum(['still', 'sequence']),
      stillBy: z.enum(['frame', 'properTime']),
      frame: z.string(),
      properTimeSeconds: z.string(),
      range: z.enum(['whole', 'range']),
      start: z.string(),
      end: z.string(),
      preset: z.string(),
      width: z.string(),
      height: z.string(),
      format: z.enum(['png8', 'png16', 'jpeg']),
      supersampling: z.string().regex(/^[1-4]$/, 'Supersampling is 1 to 4.'),
    })
    .superRefine((v, ctx) => {
      const info = frames();
      const last = info ? info.frameCount - 1 : Number.POSITIVE_INFINITY;
      const frameIssue = (path: 'frame' | 'start' | 'end', text: string, label: string) => {
        if (!wholeNumber(text)) ctx.addIssue({ code: 'custom', path: [path], message: `${label} must be a whole number.` });
        else if (Number(text) > last) ctx.addIssue({ code: 'custom', path: [path], message: `${label} must be 0 to ${last}: the revision has ${last + 1} frames.` });
      };
      if (v.kind === 'still' && v.stillBy === 'frame') frameIssue('frame', v.frame, 'The frame number');
      if (v.kind === 'still' && v.stillBy === 'properTime') {
        const seconds = Number(v.properTimeSeconds);
        if (v.properTimeSeconds.trim() === '' || !Number.isFinite(seconds) || seconds < 0) ctx.addIssue({ code: 'custom', path: ['properTimeSeconds'], message: 'Enter a proper time of 0 seconds or more.' });
        else if (info && seconds > info.properDurationSeconds) ctx.addIssue({ code: 'custom', path: ['properTimeSeconds'], message: `The path lasts ${info.properDurationSeconds.toPrecision(4)} s of proper time.` });
      }
      if (v.kind === 'sequence' && v.range === 'range') {
        frameIssue('start', v.start, 'The first frame');
        frameIssue('end', v.end, 'The last frame');
        if (wholeNumber(v.start) && wholeNumber(v.end) && Number(v.end) < Number(v.start)) ctx.addIssue({ code: 'custom', path: ['end'], message: 'The last frame must not come before the first.' });
      }
      if (v.preset === CUSTOM_PRESET_ID) {
        for (const side of ['width', 'height'] as const) {
          const n = Number(v[side]);
          if (!wholeNumber(v[side]) || n < MIN_SIDE_PX || n > MAX_SIDE_PX) ctx.addIssue({ code: 'custom', path: [side], message: `${side === 'width' ? 'Width' : 'Height'} must be ${MIN_SIDE_PX} to ${MAX_SIDE_PX} pixels.` });
        }
        const kind = projection();
        if ((kind === 'dome' || kind === 'cubeFace') && wholeNumber(v.width) && v.width.trim() !== v.height.trim() && Number(v.width) !== Number(v.height)) {
          ctx.addIssue({ code: 'custom', path: ['height'], message: `A ${kind === 'dome' ? 'dome master' : 'cube face'} is square: make the height ${Number(v.width)}.` });
        }
      }
    });
}

export type RenderRequestBody = {
  sceneId: string;
  revision: number;
  kind: 'still' | 'sequence';
  frames?: { start: number; end: number };
  settings: { width: number; height: number; format: RenderFormValues['format']; supersampling: number };
};

/**
 * The POST body for the renders API from validated form values.
 * @param v values that passed renderFormSchema
 * @param frames the revision's frame bookkeeping (needed for a still chosen by proper time)
 */
export function buildRenderRequest(v: RenderFormValues, frames: SceneFrames | null): RenderRequestBody {
  const settings = { width: Number(v.width), height: Number(v.height), format: v.format, supersampling: Number(v.supersampling) };
  const base = { sceneId: v.sceneId, revision: Number(v.revision), kind: v.kind, settings };
  if (v.kind === 'still') {
    if (v.stillBy === 'frame') return { ...base, frames: { start: Number(v.frame), end: Number(v.frame) } };
    if (!frames) throw new Error('The revision is still loading; try again in a moment.');
    const index = frames.frameAtProperTime(Number(v.properTimeSeconds));
    return { ...base, frames: { start: index, end: index } };
  }
  return v.range === 'whole' ? base : { ...base, frames: { start: Number(v.start), end: Number(v.end) } };
}
