'use client';

import { useFormContext } from 'react-hook-form';
import type { SceneSpecInput } from '@/lib/scenes/schema';
import { useEditor } from '../editor/editor-context';

/** Notes panel: the producer's words for the shot, kept with each revision. */
export function NotesPanel() {
  const { canEdit, issues } = useEditor();
  const { register } = useFormContext<SceneSpecInput>();
  return (
    <div className="space-y-2" data-testid="notes-panel">
      <label htmlFor="f-notes" className="block text-xs font-medium text-slate-300">Notes for the team and the advisor</label>
      <textarea
        id="f-notes"
        data-testid="f-notes"
        rows={8}
        readOnly={!canEdit}
        className="w-full rounded-md border border-slate-600 bg-ink-900 px-3 py-2 text-sm text-slate-200 focus:border-teal-400"
        {...register('notes')}
      />
      {issues.notes ? <p role="alert" className="text-xs text-danger-400">{issues.notes}</p> : null}
    </div>
  );
}
