'use client';

import { useEffect, useMemo, useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { useForm, useWatch, type UseFormRegisterReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiFetch, ApiError } from '@/lib/api/client';
import type { SceneSpec } from '@/lib/scenes/schema';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Field, Select, TextInput } from '@/components/ui/field';
import { formatNumber } from './format';
import { sceneFrames, type SceneFrames } from './frame-timing';
import { buildRenderRequest, FORMATS, renderFormSchema, type RenderFormValues } from './render-form-schema';
import { CUSTOM_PRESET_ID, presetsFor, type ProjectionKind } from './resolution-presets';
import type { RenderSummary } from './types';
import { rendersKey } from './use-renders';

type Show = { id: string; name: string; archived: boolean; sceneCount: number };
type Scene = { id: string; name: string; latestRevision: number };
type Revision = { number: number; message: string | null; createdAt: string };

const API_FIELD_TO_FORM: Record<string, keyof RenderFormValues> = {
  'settings.width': 'width',
  'settings.height': 'height',
  'settings.format': 'format',
  'settings.supersampling': 'supersampling',
  sceneId: 'sceneId',
  revision: 'revision',
};

function Radio({ id, label, value, register, hint }: { id: string; label: string; value: string; register: UseFormRegisterReturn; hint?: string }) {
  // The hint is a description, not part of the name, so "Still" is announced (and found) as just "Still".
  return (
    <div className="relative flex items-start gap-2 rounded-md border border-ink-700 bg-ink-900/60 px-3 py-2 text-sm has-[:checked]:border-teal-500/70 has-[:checked]:bg-teal-500/5">
      <input id={id} type="radio" value={value} className="relative z-10 mt-0.5 accent-teal-400" aria-describedby={hint ? `${id}-hint` : undefined} {...register} />
      <div>
        <label htmlFor={id} className="cursor-pointer text-slate-200 after:absolute after:inset-0">{label}</label>
        {hint ? <p id={`${id}-hint`} className="text-xs text-slate-500">{hint}</p> : null}
      </div>
    </div>
  );
}

/**
 * Request a still or a frame sequence: show -> scene -> revision, which
 * frames, the output size (presets from product.md, or custom) and format.
 * Frame counts and proper times come from the revision's own pacing curve.
 */
export function NewRenderForm({ studio }: { studio: string }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const [problem, setProblem] = useState<string | null>(null);
  const framesRef = useRef<SceneFrames | null>(null);
  const projectionRef = useRef<ProjectionKind | undefined>(undefined);
  const schema = useMemo(() => renderFormSchema(() => framesRef.current, () => projectionRef.current), []);
  const form = useForm<RenderFormValues>({
    resolver: zodResolver(schema),
    defaultValues: {
      showId: '', sceneId: '', revision: '', kind: 'still', stillBy: 'frame', frame: '0', properTimeSeconds: '0',
      range: 'whole', start: '0', end: '0', preset: 'dome-2048', width: '2048', height: '2048', format: 'png8', supersampling: '1',
    },
  });
  const { register, handleSubmit, setValue, setError, formState, control } = form;
  const [showId, sceneId, revision, kind, stillBy, range, preset, properTimeSeconds] = useWatch({ control, name: ['showId', 'sceneId', 'revision', 'kind', 'stillBy', 'range', 'preset', 'properTimeSeconds'] });
  const errors = formState.errors;

  const shows = useQuery({ queryKey: ['studio', studio, 'shows'], queryFn: () => apiFetch<{ shows: Show[] }>(`/api/v1/studios/${studio}/shows`) });
  const scenes = useQuery({
    queryKey: ['studio', studio, 'shows', showId, 'scenes'],
    queryFn: () => apiFetch<{ scenes: Scene[] }>(`/api/v1/studios/${studio}/shows/${showId}/scenes`),
    enabled: showId !== '',
  });
  const revisions = useQuery({
    queryKey: ['studio', studio, 'scenes', sceneId, 'revisions'],
    queryFn: () => apiFetch<{ revisions: Revision[] }>(`/api/v1/studios/${studio}/scenes/${sceneId}/revisions`),
    enabled: sceneId !== '',
  });
  const revisionSpec = useQuery({
    queryKey: ['studio', studio, 'scenes', sceneId, 'revisions', revision],
    queryFn: () => apiFetch<{ revision: { spec: SceneSpec } }>(`/api/v1/studios/${studio}/scenes/${sceneId}/revisions/${revision}`),
    enabled: sceneId !== '' && revision !== '',
    staleTime: Infinity, // revisions are immutable
  });

  const spec = revisionSpec.data?.revision.spec;
  const frames = useMemo(() => {
    if (!spec) return null;
    try {
      return sceneFrames(spec);
    } catch {
      return null;
    }
  }, [spec]);
  const projection = spec?.projection.kind as ProjectionKind | undefined;
  framesRef.current = frames;
  projectionRef.current = projection;
  const presets = presetsFor(projection);

  // Pick the first show, the first scene and the newest revision as each list arrives, so the keyboard path is short.
  useEffect(() => {
    const first = shows.data?.shows.find((s) => !s.archived);
    if (showId === '' && first) setValue('showId', first.id);
  }, [shows.data, showId, setValue]);
  useEffect(() => {
    const list = scenes.data?.scenes ?? [];
    if (list.length && !list.some((s) => s.id === sceneId)) setValue('sceneId', list[0].id);
  }, [scenes.data, sceneId, setValue]);
  useEffect(() => {
    const list = revisions.data?.revisions ?? [];
    if (list.length && !list.some((r) => String(r.number) === revision)) setValue('revision', String(list[0].number));
  }, [revisions.data, revision, setValue]);
  useEffect(() => {
    if (frames) setValue('end', String(frames.frameCount - 1));
  }, [frames, setValue]);
  useEffect(() => {
    // A dome master must stay square: move off a preset that does not suit the revision's projection.
    if (projection && preset !== CUSTOM_PRESET_ID && !presets.some((p) => p.id === preset)) setValue('preset', presets[0]?.id ?? CUSTOM_PRESET_ID);
  }, [projection, preset, presets, setValue]);
  useEffect(() => {
    const chosen = presets.find((p) => p.id === preset);
    if (chosen) {
      setValue('width', String(chosen.width));
      setValue('height', String(chosen.height));
    }
  }, [preset, presets, setValue]);

  const mutation = useMutation({
    mutationFn: (values: RenderFormValues) => apiFetch<{ render: RenderSummary }>(`/api/v1/studios/${studio}/renders`, { method: 'POST', body: buildRenderRequest(values, frames) }),
    onMutate: () => setProblem(null),
    onSuccess: ({ render }) => {
      queryClient.invalidateQueries({ queryKey: rendersKey(studio) });
      router.push(`/studios/${studio}/renders/${render.id}`);
    },
    onError: (error) => {
      if (error instanceof ApiError) {
        for (const f of error.fieldErrors) {
          const field = API_FIELD_TO_FORM[f.field] ?? (f.field === 'frames' ? (kind === 'still' ? 'frame' : 'start') : undefined);
          if (field) setError(field, { message: f.message });
        }
      }
      setProblem(error.message);
    },
  });

  const properFrame = useMemo(() => {
    const seconds = Number(properTimeSeconds);
    if (!frames || properTimeSeconds.trim() === '' || !Number.isFinite(seconds) || seconds < 0) return null;
    return frames.frameAtProperTime(seconds);
  }, [frames, properTimeSeconds]);

  const showList = shows.data?.shows.filter((s) => !s.archived) ?? [];
  const sceneList = scenes.data?.scenes ?? [];
  const revisionList = revisions.data?.revisions ?? [];
  const loadError = shows.error ?? scenes.error ?? revisions.error ?? revisionSpec.error;

  return (
    <form onSubmit={handleSubmit((v) => mutation.mutate(v))} noValidate className="space-y-6" data-testid="new-render-form">
      {loadError ? <Alert tone="error">{loadError.message}</Alert> : null}

      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-sm font-semibold text-slate-200">What to render</legend>
        <Field id="render-show" label="Show" error={errors.showId?.message}>
          <Select id="render-show" {...register('showId', { onChange: () => { setValue('sceneId', ''); setValue('revision', ''); } })} disabled={shows.isPending}>
            {showList.length === 0 ? <option value="">{shows.isPending ? 'Loading…' : 'No shows'}</option> : null}
            {showList.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
          </Select>
        </Field>
        <Field id="render-scene" label="Scene" error={errors.sceneId?.message}>
          <Select id="render-scene" {...register('sceneId', { onChange: () => setValue('revision', '') })} disabled={sceneList.length === 0}>
            {sceneList.length === 0 ? <option value="">{scenes.isFetching ? 'Loading…' : 'No scenes'}</option> : null}
            {sceneList.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
          </Select>
        </Field>
        <Field id="render-revision" label="Revision" error={errors.revision?.message}>
          <Select id="render-revision" {...register('revision')} disabled={revisionList.length === 0}>
            {revisionList.length === 0 ? <option value="">{revisions.isFetching ? 'Loading…' : 'No revisions'}</option> : null}
            {revisionList.map((r, i) => <option key={r.number} value={String(r.number)}>Revision {r.number}{i === 0 ? ' (latest)' : ''}{r.message ? ` — ${r.message}` : ''}</option>)}
          </Select>
        </Field>
      </fieldset>

      {frames ? (
        <p className="text-xs text-slate-400" data-testid="scene-frames">
          This revision paces to <span className="tabular-nums text-slate-200">{frames.frameCount}</span> frames at {frames.frameRate} fps
          ({formatNumber(frames.frameCount / frames.frameRate, 3)} s on screen) covering {formatNumber(frames.properDurationSeconds, 4)} s of the traveller&apos;s proper time.
          {projection ? <> Projection: {projection === 'dome' ? 'dome master (square)' : projection}.</> : null}
        </p>
      ) : revisionSpec.isFetching ? <p className="text-xs text-slate-500">Reading the revision…</p> : null}

      <fieldset className="space-y-3">
        <legend className="mb-2 text-sm font-semibold text-slate-200">Frames</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          <Radio id="kind-still" label="Still" value="still" register={register('kind')} hint="One frame, as a check or a poster" />
          <Radio id="kind-sequence" label="Frame sequence" value="sequence" register={register('kind')} hint="Frames for the show, checked for photosensitivity" />
        </div>
        {kind === 'still' ? (
          <div className="grid gap-3 rounded-md border border-ink-700 p-3 sm:grid-cols-[auto_1fr] sm:items-end">
            <div className="flex gap-2" role="radiogroup" aria-label="Pick the frame by">
              <Radio id="still-by-frame" label="Frame number" value="frame" register={register('stillBy')} />
              <Radio id="still-by-time" label="Proper time" value="properTime" register={register('stillBy')} />
            </div>
            {stillBy === 'frame' ? (
              <Field id="render-frame" label={`Frame number${frames ? ` (0–${frames.frameCount - 1})` : ''}`} error={errors.frame?.message}>
                <TextInput id="render-frame" inputMode="numeric" invalid={!!errors.frame} {...register('frame')} />
              </Field>
            ) : (
              <Field id="render-proper-time" label={`Proper time, seconds${frames ? ` (0–${formatNumber(frames.properDurationSeconds, 4)})` : ''}`} error={errors.properTimeSeconds?.message}>
                <TextInput id="render-proper-time" inputMode="decimal" invalid={!!errors.properTimeSeconds} {...register('properTimeSeconds')} />
                {properFrame !== null ? <p className="text-xs text-slate-400" data-testid="proper-time-frame">Frame {properFrame}</p> : null}
              </Field>
            )}
          </div>
        ) : (
          <div className="grid gap-3 rounded-md border border-ink-700 p-3 sm:grid-cols-[auto_1fr_1fr] sm:items-end">
            <div className="flex gap-2" role="radiogroup" aria-label="Which frames">
              <Radio id="range-whole" label="Whole scene" value="whole" register={register('range')} />
              <Radio id="range-part" label="Frame range" value="range" register={register('range')} />
            </div>
            {range === 'range' ? (
              <>
                <Field id="render-start" label="First frame" error={errors.start?.message}>
                  <TextInput id="render-start" inputMode="numeric" invalid={!!errors.start} {...register('start')} />
                </Field>
                <Field id="render-end" label="Last frame" error={errors.end?.message}>
                  <TextInput id="render-end" inputMode="numeric" invalid={!!errors.end} {...register('end')} />
                </Field>
              </>
            ) : (
              <p className="text-sm text-slate-400 sm:col-span-2">{frames ? `All ${frames.frameCount} frames, 0–${frames.frameCount - 1}.` : 'All frames of the revision.'}</p>
            )}
          </div>
        )}
      </fieldset>

      <fieldset className="grid gap-4 sm:grid-cols-4">
        <legend className="mb-2 text-sm font-semibold text-slate-200">Output</legend>
        <div className="sm:col-span-2">
          <Field id="render-preset" label="Resolution" error={errors.preset?.message}>
            <Select id="render-preset" {...register('preset')}>
              {presets.map((p) => <option key={p.id} value={p.id}>{p.label}</option>)}
              <option value={CUSTOM_PRESET_ID}>Custom size…</option>
            </Select>
          </Field>
        </div>
        <Field id="render-format" label="Format" error={errors.format?.message}>
          <Select id="render-format" {...register('format')}>
            {FORMATS.map((f) => <option key={f.value} value={f.value}>{f.label}</option>)}
          </Select>
        </Field>
        <Field id="render-supersampling" label="Supersampling" error={errors.supersampling?.message}>
          <Select id="render-supersampling" {...register('supersampling')}>
            {[1, 2, 3, 4].map((n) => <option key={n} value={String(n)}>{n === 1 ? 'None (1×1)' : `${n}×${n} rays per pixel`}</option>)}
          </Select>
        </Field>
        {preset === CUSTOM_PRESET_ID ? (
          <>
            <Field id="render-width" label="Width (px)" error={errors.width?.message}>
              <TextInput id="render-width" inputMode="numeric" invalid={!!errors.width} {...register('width')} />
            </Field>
            <Field id="render-height" label="Height (px)" error={errors.height?.message}>
              <TextInput id="render-height" inputMode="numeric" invalid={!!errors.height} {...register('height')} />
            </Field>
            {projection === 'dome' || projection === 'cubeFace' ? <p className="self-end pb-2 text-xs text-slate-500 sm:col-span-2">A {projection === 'dome' ? 'dome master' : 'cube face'} is square: width and height must match.</p> : null}
          </>
        ) : null}
      </fieldset>

      <p className="text-xs text-slate-500">Renders of a revision that an advisor has not approved are marked as drafts; their deliveries say so.</p>
      {problem ? <Alert tone="error" testId="new-render-error">{problem}</Alert> : null}
      <div className="flex items-center gap-3">
        <Button type="submit" disabled={mutation.isPending || !frames} data-testid="request-render">{mutation.isPending ? 'Requesting…' : 'Request render'}</Button>
        <a href={`/studios/${studio}/renders`} className="text-sm text-slate-400 hover:text-teal-300 hover:underline">Back to renders</a>
      </div>
    </form>
  );
}
