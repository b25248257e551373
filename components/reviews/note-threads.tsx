'use client';

import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { formatDuration, formatScreenTime } from '@/components/scenes/editor/format';
import type { NoteStatus, ReviewNoteView } from './types';

const STATUS_CLASSES: Record<NoteStatus, string> = {
  open: 'border-violet-500/50 text-violet-300',
  resolved: 'border-teal-500/50 text-teal-300',
  accepted: 'border-slate-500 text-slate-300',
};

const textArea = 'w-full rounded-md border border-slate-600 bg-ink-900 px-3 py-2 text-sm text-slate-200 placeholder:text-slate-500 focus:border-teal-400';

/**
 * Notes pinned to moments of the path, each with its thread of replies.
 * Advisors resolve, accept or reopen a note; everyone who may comment replies.
 */
export function NoteThreads({
  notes,
  open,
  canReply,
  canSetStatus,
  screenTimeOf,
  secondsPerM,
  onGoTo,
  onReply,
  onStatus,
  busy,
  error,
}: {
  notes: ReviewNoteView[];
  open: boolean;
  canReply: boolean;
  canSetStatus: boolean;
  screenTimeOf: (tauM: number) => number;
  secondsPerM: number;
  onGoTo: (note: ReviewNoteView) => void;
  onReply: (parentId: string, body: string) => Promise<unknown>;
  onStatus: (noteId: string, status: NoteStatus) => void;
  busy: boolean;
  error: string | null;
}) {
  const threads = notes.filter((n) => n.parentId === null).sort((a, b) => (a.tau ?? 0) - (b.tau ?? 0));
  if (threads.length === 0) return <p className="text-sm text-slate-400" data-testid="no-notes">No notes yet.</p>;
  return (
    <div className="space-y-3">
      {error ? <Alert tone="error" testId="note-error">{error}</Alert> : null}
      <ol className="space-y-3">
        {threads.map((note) => (
          <li key={note.id} className="rounded-md border border-ink-700 bg-ink-900/60 p-3" data-testid="note-thread" data-note-id={note.id} data-status={note.status}>
            <div className="flex flex-wrap items-center gap-2 text-xs">
              <button type="button" className="rounded border border-slate-600 px-2 py-0.5 tabular-nums text-slate-200 hover:border-teal-400 hover:text-teal-300" onClick={() => onGoTo(note)} data-testid="note-goto" title="Scrub to this moment">
                {note.tau === null ? '–' : `${formatScreenTime(screenTimeOf(note.tau))} screen · ${formatDuration(note.tau * secondsPerM)} proper`}
              </button>
              {note.point ? <span className="text-slate-500">point {Math.round(note.point.x * 100)}%, {Math.round(note.point.y * 100)}%</span> : null}
              <span className={`rounded-full border px-2 py-0.5 ${STATUS_CLASSES[note.status]}`} data-testid="note-status">{note.status}</span>
              <span className="ml-auto text-slate-500">{note.author ?? 'former member'}</span>
            </div>
            <p className="mt-2 whitespace-pre-wrap text-sm text-slate-100" data-testid="note-body">{note.body}</p>
            <ul className="mt-2 space-y-2 border-l border-ink-700 pl-3">
              {notes.filter((r) => r.parentId === note.id).map((reply) => (
                <li key={reply.id} className="text-sm" data-testid="note-reply">
                  <span className="text-xs text-slate-500">{reply.author ?? 'former member'}: </span>
                  <span className="whitespace-pre-wrap text-slate-200">{reply.body}</span>
                </li>
              ))}
            </ul>
            {open ? (
              <div className="mt-2 flex flex-wrap items-start gap-2">
                {canReply ? <ReplyForm noteId={note.id} onReply={onReply} busy={busy} /> : null}
                {canSetStatus ? (
                  <div className="flex gap-2">
                    {note.status !== 'resolved' ? <Button variant="secondary" className="px-2 py-1 text-xs" disabled={busy} onClick={() => onStatus(note.id, 'resolved')} data-testid="note-resolve" title="The producer fixed it">Resolve</Button> : null}
                    {note.status !== 'accepted' ? <Button variant="secondary" className="px-2 py-1 text-xs" disabled={busy} onClick={() => onStatus(note.id, 'accepted')} data-testid="note-accept" title="Fine as it stands">Accept as is</Button> : null}
                    {note.status !== 'open' ? <Button variant="secondary" className="px-2 py-1 text-xs" disabled={busy} onClick={() => onStatus(note.id, 'open')} data-testid="note-reopen">Reopen</Button> : null}
                  </div>
                ) : null}
              </div>
            ) : null}
          </li>
        ))}
      </ol>
    </div>
  );
}

function ReplyForm({ noteId, onReply, busy }: { noteId: string; onReply: (parentId: string, body: string) => Promise<unknown>; busy: boolean }) {
  const [body, setBody] = useState('');
  return (
    <form
      className="flex min-w-64 flex-1 gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (body.trim()) void onReply(noteId, body.trim()).then(() => setBody(''), () => undefined);
      }}
    >
      <label className="sr-only" htmlFor={`reply-${noteId}`}>Reply</label>
      <input id={`reply-${noteId}`} className={textArea} placeholder="Reply in this thread" value={body} onChange={(e) => setBody(e.target.value)} data-testid="reply-body" maxLength={5000} />
      <Button type="submit" variant="secondary" className="px-2 py-1 text-xs" disabled={busy || !body.trim()} data-testid="reply-send">Reply</Button>
    </form>
  );
}
