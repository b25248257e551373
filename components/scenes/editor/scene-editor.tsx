'use client';

import Link from 'next/link';
import { useEffect, useMemo, useState } from 'react';
import { FormProvider, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { massScale } from '@/lib/relativity';
import { sceneSpecSchema, type SceneSpec, type SceneSpecInput } from '@/lib/scenes/schema';
import { Alert } from '@/components/ui/alert';
import { EditorContext, timeUnitFor, type EditorContextValue } from './editor-context';
import { buildLiveScene, useLiveScene } from './use-live-scene';
import { draftKey, useDraft } from './use-draft';
import { EditorTabs } from './editor-tabs';
import { SaveBar, type SaveOutcome } from './save-bar';
import { PacingEditor } from '../timeline/pacing-editor';
import { EditorWorkspace } from './editor-workspace';

export interface SceneEditorProps {
  studio: string;
  show: { id: string; name: string };
  scene: { id: string; name: string; slug: string; latestRevision: number };
  revision: { number: number; createdAt: string; message: string | null; spec: SceneSpecInput };
  canEdit: boolean;
  userId: string;
}

/** The loaded spec with every default filled in, so the form shows what the renderer will use. */
function normalise(spec: SceneSpecInput): SceneSpecInput {
  const parsed = sceneSpecSchema.safeParse(spec);
  return (parsed.success ? parsed.data : spec) as SceneSpecInput;
}

const sameValues = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/** The scene editor: panels, live preview with its scrubber, readouts, charts and saving as revisions. */
export function SceneEditor(props: SceneEditorProps) {
  const { studio, show, scene, canEdit, userId } = props;
  const [loaded, setLoaded] = useState(() => ({ number: props.revision.number, values: normalise(props.revision.spec) }));
  const [initialLive] = useState(() => buildLiveScene(loaded.values));
  const form = useForm<SceneSpecInput, unknown, SceneSpec>({ resolver: zodResolver(sceneSpecSchema), defaultValues: loaded.values, mode: 'onSubmit' });
  const values = useWatch({ control: form.control }) as SceneSpecInput;
  const dirty = useMemo(() => !sameValues(values, loaded.values), [values, loaded.values]);
  const { live, issues, pending, valid } = useLiveScene(values, initialLive);
  const draft = useDraft<SceneSpecInput>(draftKey(userId, scene.id, loaded.number), values, dirty, canEdit);
  const [outcome, setOutcome] = useState<SaveOutcome | null>(null);

  const mass = Number(values.massSolar);
  const scale = Number.isFinite(mass) && mass > 0 && mass <= 1e11 ? massScale(mass) : null;
  const secondsPerM = scale?.secondsPerM ?? null;
  const metresPerM = scale?.metresPerM ?? null;
  // stable between edits, so scrubbing (EditorWorkspace's own state) re-renders none of the panels
  const context: EditorContextValue = useMemo(
    () => ({ canEdit, secondsPerM, metresPerM, time: timeUnitFor(secondsPerM), issues, live }),
    [canEdit, secondsPerM, metresPerM, issues, live],
  );
  const pacing = useMemo(() => <PacingEditor />, []);
  const tabs = useMemo(() => <EditorTabs />, []);

  const restoreDraft = () => {
    if (!draft.offered) return;
    form.reset(draft.offered.values, { keepDefaultValues: true });
    draft.accept();
  };

  const onSaved = (saved: { number: number; superseded: boolean; basedOn: number }) => {
    draft.clear();
    setLoaded({ number: saved.number, values });
    form.reset(values);
    setOutcome({ tone: saved.superseded ? 'caution' : 'info', saved });
    window.history.replaceState(null, '', `?revision=${saved.number}`);
  };

  useEffect(() => {
    if (dirty) setOutcome((o) => (o && o.tone === 'info' ? null : o));
  }, [dirty]);

  return (
    <FormProvider {...form}>
      <EditorContext.Provider value={context}>
        <div className="space-y-4" data-testid="scene-editor" data-can-edit={canEdit ? 'true' : 'false'}>
          <nav aria-label="Breadcrumb" className="text-sm text-slate-400">
            <Link href={`/studios/${studio}/shows`} className="hover:text-teal-300">Shows</Link>
            <span className="mx-2 text-slate-600">/</span>
            <Link href={`/studios/${studio}/shows/${show.id}`} className="hover:text-teal-300">{show.name}</Link>
            <span className="mx-2 text-slate-600">/</span>
            <span className="text-slate-300">{scene.name}</span>
          </nav>
          <SaveBar
            studio={studio}
            sceneId={scene.id}
            sceneName={scene.name}
            basedOn={loaded.number}
            dirty={dirty}
            valid={valid !== false && !pending}
            canEdit={canEdit}
            draftSavedAt={draft.lastSavedAt}
            onSaved={onSaved}
            outcome={outcome}
          />
          {!canEdit ? (
            <Alert tone="info" testId="read-only-notice">
              Read-only: you can scrub, preview and read every value, but only producers and admins change scenes. Any change they save becomes a new revision.
            </Alert>
          ) : null}
          {draft.offered ? (
            <div className="flex flex-wrap items-center gap-3 rounded-md border border-violet-500/40 bg-violet-500/10 px-3 py-2 text-sm text-violet-300" role="status" data-testid="draft-prompt">
              <span>You have unsaved changes to revision {loaded.number} from {new Date(draft.offered.savedAt).toLocaleString()} kept in this browser.</span>
              <button type="button" onClick={restoreDraft} className="rounded border border-violet-400 px-2 py-0.5 text-violet-200 hover:bg-violet-500/20" data-testid="restore-draft">Restore draft</button>
              <button type="button" onClick={draft.discard} className="text-violet-300 hover:underline" data-testid="discard-draft">Discard it</button>
            </div>
          ) : null}

          <EditorWorkspace live={live} valid={valid} secondsPerM={secondsPerM} pacing={pacing} tabs={tabs} />
        </div>
      </EditorContext.Provider>
    </FormProvider>
  );
}
