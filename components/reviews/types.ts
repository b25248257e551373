/** The review API's answers as the browser sees them (app/api/v1/studios/[studio]/reviews/**). */
export type ReviewState = 'in_review' | 'approved' | 'changes_requested';

export type ReviewListItem = { id: string; state: ReviewState; sceneId: string; sceneName: string; revision: number; openNotes: number; createdAt: string; decidedAt: string | null };

export type NoteStatus = 'open' | 'resolved' | 'accepted';

export type ReviewNoteView = { id: string; parentId: string | null; author: string | null; tau: number | null; point: { x: number; y: number } | null; body: string; status: NoteStatus; createdAt: string };

export type FieldChange = { pointer: string; change: 'added' | 'removed' | 'changed'; before?: unknown; after?: unknown };

export type ReviewDetail = {
  review: { id: string; state: ReviewState; sceneId: string; sceneName: string; revision: number; contentHash: string; advisorIds: string[]; message: string | null; decisionNote: string | null; decidedAt: string | null; createdAt: string };
  approval: { contentHash: string; approvedById: string; at: string } | null;
  notes: ReviewNoteView[];
  diffFromApproved: { from: number; changes: FieldChange[] } | null;
};

export const STATE_LABELS: Record<ReviewState, string> = { in_review: 'In review', approved: 'Approved', changes_requested: 'Changes requested' };

/** Badge classes per state: teal and violet accents, never a traffic-light scheme (product.md, Look). */
export const STATE_BADGES: Record<ReviewState, string> = {
  in_review: 'border-violet-500/50 bg-violet-500/10 text-violet-300',
  approved: 'border-teal-500/50 bg-teal-500/10 text-teal-300',
  changes_requested: 'border-slate-500 bg-ink-700 text-slate-200',
};

/** The review API's base path for a studio. */
export const reviewsApi = (studio: string) => `/api/v1/studios/${studio}/reviews`;
