'use client';

import { useState } from 'react';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import type { ReviewDetail } from './types';

/**
 * The advisor's decision: approve (refused with the server's message while
 * notes are open) or ask for changes with a message. Others see the outcome.
 */
export function DecisionPanel({ detail, canDecide, onApprove, onRequestChanges, busy, error }: { detail: ReviewDetail; canDecide: boolean; onApprove: () => void; onRequestChanges: (message: string) => void; busy: boolean; error: string | null }) {
  const [message, setMessage] = useState('');
  const { review, approval } = detail;
  const openNotes = detail.notes.filter((n) => n.parentId === null && n.status === 'open').length;
  return (
    <div className="space-y-3" data-testid="decision">
      {review.state === 'approved' && approval ? (
        <Alert tone="info" testId="approved-note">
          Approved {new Date(approval.at).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })} · content hash <code className="font-mono text-xs">{approval.contentHash.slice(0, 16)}</code>. Final renders of this revision are now possible; any edit makes a new revision that needs its own approval.
        </Alert>
      ) : null}
      {review.state === 'changes_requested' ? (
        <Alert tone="caution" testId="changes-note">
          Changes requested: <span className="whitespace-pre-wrap">{review.decisionNote}</span>
          <br />Edit the scene (a new revision) and submit it again from Reviews.
        </Alert>
      ) : null}
      {review.state === 'in_review' && !canDecide ? <p className="text-sm text-slate-400">Waiting for an advisor. You can reply in the notes&apos; threads.</p> : null}
      {review.state === 'in_review' && canDecide ? (
        <>
          <p className="text-sm text-slate-400">{openNotes === 0 ? 'No open notes.' : `${openNotes} open note${openNotes === 1 ? '' : 's'}: resolve or accept ${openNotes === 1 ? 'it' : 'them'} before approving.`}</p>
          <Button onClick={onApprove} disabled={busy} data-testid="approve">Approve revision {review.revision}</Button>
          <div className="space-y-2 border-t border-ink-700 pt-3">
            <label htmlFor="changes-message" className="block text-sm font-medium text-slate-300">Ask for changes</label>
            <textarea id="changes-message" rows={3} maxLength={5000} value={message} onChange={(e) => setMessage(e.target.value)} data-testid="changes-message" placeholder="What should change, and why" className="w-full rounded-md border border-slate-600 bg-ink-900 px-3 py-2 text-sm text-slate-200 placeholder:text-slate-500 focus:border-teal-400" />
            <Button variant="secondary" disabled={busy || !message.trim()} onClick={() => onRequestChanges(message.trim())} data-testid="request-changes">Ask for changes</Button>
          </div>
        </>
      ) : null}
      {error ? <Alert tone="error" testId="decision-error">{error}</Alert> : null}
    </div>
  );
}
