'use client';

import { useState } from 'react';
import { useFormContext } from 'react-hook-form';
import { apiFetch, ApiError } from '@/lib/api/client';
import type { SceneSpec, SceneSpecInput } from '@/lib/scenes/schema';
import { Button } from '@/components/ui/button';
import { Alert } from '@/components/ui/alert';

export interface SaveOutcome {
  tone: 'info' | 'caution';
  saved: { number: number; superseded: boolean; basedOn: number };
}

type SaveAnswer = { revision: { number: number; basedOn: number | null }; superseded: boolean };

/** Title row: revision status, the draft note, and "save as a new revision" with an optional message. */
export function SaveBar({
  studio,
  sceneId,
  sceneName,
  basedOn,
  dirty,
  valid,
  canEdit,
  draftSavedAt,
  onSaved,
  outcome,
}: {
  studio: string;
  sceneId: string;
  sceneName: string;
  basedOn: number;
  dirty: boolean;
  valid: boolean;
  canEdit: boolean;
  draftSavedAt: string | null;
  onSaved: (saved: SaveOutcome['saved']) => void;
  outcome: SaveOutcome | null;
}) {
  const form = useFormContext<SceneSpecInput, unknown, SceneSpec>();
  const [message, setMessage] = useState('');
  const [failure, setFailure] = useState<string | null>(null);
  const [saving, setSaving] = useState(false);

  const save = form.handleSubmit(
    async (spec) => {
      setSaving(true);
      setFailure(null);
      try {
        const answer = await apiFetch<SaveAnswer>(`/api/v1/studios/${studio}/scenes/${sceneId}/revisions`, {
          method: 'POST',
          body: { basedOn, spec, ...(message.trim() ? { message: message.trim() } : {}) },
        });
        setMessage('');
        onSaved({ number: answer.revision.number, superseded: answer.superseded, basedOn });
      } catch (error) {
        const fields = error instanceof ApiError && error.fieldErrors.length > 0 ? ` (${error.fieldErrors.map((f) => `${f.field}: ${f.message}`).join('; ')})` : '';
        setFailure(`${error instanceof Error ? error.message : 'Saving failed.'}${fields} Your changes are still here and kept as a draft.`);
      } finally {
        setSaving(false);
      }
    },
    () => setFailure('Some fields need attention (marked in red) before this can be saved.'),
  );

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold" data-testid="scene-title">{sceneName}</h1>
          <p className="text-sm text-slate-400" data-testid="revision-status">
            Revision {basedOn}
            {dirty ? <span className="text-violet-300"> · unsaved changes</span> : <span> · saved</span>}
            {dirty && draftSavedAt ? <span className="text-slate-500"> · draft kept in this browser {new Date(draftSavedAt).toLocaleTimeString()}</span> : null}
          </p>
        </div>
        {canEdit ? (
          <form
            className="flex flex-wrap items-center gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              void save();
            }}
          >
            <label htmlFor="revision-message" className="sr-only">What changed</label>
            <input
              id="revision-message"
              data-testid="revision-message"
              placeholder="What changed (optional)"
              value={message}
              maxLength={500}
              onChange={(e) => setMessage(e.target.value)}
              className="w-64 rounded-md border border-slate-600 bg-ink-900 px-3 py-2 text-sm text-slate-200 placeholder:text-slate-500 focus:border-teal-400"
            />
            <Button type="submit" disabled={saving || !dirty || !valid} data-testid="save-revision" title={!dirty ? 'Nothing to save yet' : !valid ? 'Fix the marked fields first' : undefined}>
              {saving ? 'Saving…' : 'Save as new revision'}
            </Button>
          </form>
        ) : null}
      </div>
      {failure ? <Alert tone="error" testId="save-error">{failure}</Alert> : null}
      {outcome && outcome.tone === 'info' ? <Alert tone="info" testId="save-outcome">Saved as revision {outcome.saved.number}.</Alert> : null}
      {outcome && outcome.tone === 'caution' ? (
        <Alert tone="caution" testId="save-outcome">
          Someone else saved revision {outcome.saved.number - 1 > outcome.saved.basedOn + 1 ? `${outcome.saved.basedOn + 1}–${outcome.saved.number - 1}` : outcome.saved.number - 1} while you were editing revision{' '}
          {outcome.saved.basedOn}. Both are kept: yours is revision {outcome.saved.number}.{' '}
          <a className="underline" href={`?revision=${outcome.saved.number - 1}`}>Open revision {outcome.saved.number - 1}</a> to compare.
        </Alert>
      ) : null}
    </div>
  );
}
