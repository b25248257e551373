import 'server-only';
import { Op } from 'sequelize';
import { appUrl } from '@/lib/env';
import { badRequest, conflict, forbidden, notFound } from '@/lib/errors';
import type { StudioAccess } from '@/lib/auth/actor';
import { sendEmail } from '@/lib/email/send';
import { diffSpecs } from '@/lib/scenes/diff';
import { sceneWorldline } from '@/lib/scenes/readout';
import { findRevision, findScene } from '@/lib/scenes/service';
import { audit } from '@/lib/studio/audit';
import { Approval, Membership, Review, ReviewNote, Scene, SceneRevision, User, sequelize } from '@/models';

const reviewLink = (slug: string, reviewId: string) => `${appUrl}/studios/${slug}/reviews/${reviewId}`;

export async function approvalOf(revisionId: string): Promise<Approval | null> {
  return Approval.findOne({ where: { revisionId } });
}

/** The newest approved revision of a scene before `beforeNumber`, if any. */
export async function lastApprovedRevision(sceneId: string, beforeNumber: number): Promise<SceneRevision | null> {
  const approvals = await Approval.findAll({ where: { sceneId }, attributes: ['revisionId'] });
  if (!approvals.length) return null;
  return SceneRevision.findOne({ where: { id: { [Op.in]: approvals.map((a) => a.revisionId) }, number: { [Op.lt]: beforeNumber } }, order: [['number', 'DESC']] });
}

async function advisorsToNotify(studioId: string, named: string[]): Promise<User[]> {
  const advisors = await Membership.findAll({ where: { studioId, role: 'advisor', ...(named.length ? { userId: { [Op.in]: named } } : {}) }, include: [{ model: User, as: 'user', required: true }] });
  return advisors.map((m) => m.user!);
}

/** A producer submits a revision for review; advisors (named, or all) are e-mailed. */
export async function submitForReview(access: StudioAccess, actor: { userId: string; name: string }, input: { sceneId: string; revision: number; advisorIds?: string[]; message?: string }) {
  const scene = await findScene(access.studio.id, input.sceneId);
  const revision = await findRevision(access.studio.id, scene.id, input.revision);
  if (await approvalOf(revision.id)) throw conflict(`Revision ${revision.number} is already approved.`);
  const named = input.advisorIds ?? [];
  const advisors = await advisorsToNotify(access.studio.id, named);
  if (named.length && advisors.length !== new Set(named).size) throw badRequest('advisorIds must name advisors of this studio.', { errors: [{ field: 'advisorIds', message: 'every id must be an advisor of this studio' }] });
  if (!advisors.length) throw conflict('This studio has no advisor yet; an admin can invite one from the Studio page.');
  const review = await sequelize.transaction(async (transaction) => {
    if (await Review.findOne({ where: { revisionId: revision.id, state: 'in_review' }, transaction })) throw conflict(`Revision ${revision.number} is already in review.`);
    const created = await Review.create({ studioId: access.studio.id, sceneId: scene.id, revisionId: revision.id, advisorIds: named, message: input.message ?? null, submittedById: actor.userId, decidedById: null, decidedAt: null, decisionNote: null }, { transaction });
    await audit({ studioId: access.studio.id, actorId: actor.userId, action: 'review.submitted', targetType: 'review', targetId: created.id, data: { sceneId: scene.id, revision: revision.number, contentHash: revision.contentHash } }, transaction);
    return created;
  });
  for (const advisor of advisors) {
    await sendEmail({
      studioId: access.studio.id, kind: 'review-requested', to: advisor.email,
      subject: `Review requested: ${scene.name}, revision ${revision.number}`,
      text: [`${actor.name} asks you to review "${scene.name}" (revision ${revision.number}) in ${access.studio.name}.`, input.message ? `\nTheir note: ${input.message}\n` : '', `Open the review and its accuracy report: ${reviewLink(access.studio.slug, review.id)}`].join('\n'),
    });
  }
  return review;
}

export async function findReview(studioId: string, reviewId: string): Promise<Review> {
  const review = await Review.findOne({ where: { id: reviewId, studioId } });
  if (!review) throw notFound('Review');
  return review;
}

/** Adds a note pinned to a proper time (advisors) or a reply in a thread (advisors, producers, admins). */
export async function addNote(access: StudioAccess, actorId: string, reviewId: string, input: { body: string; tau?: number; point?: { x: number; y: number }; parentId?: string }) {
  const review = await findReview(access.studio.id, reviewId);
  if (review.state !== 'in_review') throw conflict('This review is closed; submit the revision again to discuss it.');
  if (input.parentId) {
    const parent = await ReviewNote.findOne({ where: { id: input.parentId, reviewId } });
    if (!parent) throw notFound('Note');
    if (parent.parentId) throw badRequest('Reply to the thread\'s first note, not to a reply.', { errors: [{ field: 'parentId', message: 'must be a top-level note' }] });
  } else {
    if (access.role !== 'advisor') throw forbidden('Only advisors pin new notes; reply in a thread instead.');
    if (input.tau === undefined) throw badRequest('A note needs the proper time it is pinned to.', { errors: [{ field: 'tau', message: 'required for a new note' }] });
    const revision = await SceneRevision.findByPk(review.revisionId);
    const duration = sceneWorldline(revision!.spec).duration;
    if (input.tau > duration) throw badRequest(`tau must lie on the path: 0 to ${duration.toPrecision(6)} M.`, { errors: [{ field: 'tau', message: `at most ${duration.toPrecision(6)}` }] });
  }
  const note = await ReviewNote.create({ studioId: access.studio.id, reviewId, parentId: input.parentId ?? null, authorId: actorId, tau: input.parentId ? null : input.tau!, pointX: input.point?.x ?? null, pointY: input.point?.y ?? null, body: input.body, statusChangedById: null });
  await audit({ studioId: access.studio.id, actorId, action: input.parentId ? 'review.replied' : 'review.noted', targetType: 'review', targetId: reviewId, data: { noteId: note.id } });
  return note;
}

/** Advisors resolve a note, accept it as it stands, or reopen it. */
export async function setNoteStatus(access: StudioAccess, actorId: string, reviewId: string, noteId: string, status: 'open' | 'resolved' | 'accepted') {
  const review = await findReview(access.studio.id, reviewId);
  if (access.role !== 'advisor') throw forbidden('Only advisors resolve or accept notes.');
  if (review.state !== 'in_review') throw conflict('This review is closed.');
  const note = await ReviewNote.findOne({ where: { id: noteId, reviewId, parentId: null } });
  if (!note) throw notFound('Note');
  await note.update({ status, statusChangedById: actorId });
  await audit({ studioId: access.studio.id, actorId, action: `review.note_${status}`, targetType: 'review', targetId: reviewId, data: { noteId } });
  return note;
}

async function notifySubmitter(review: Review, slug: string, subject: string, text: string) {
  const submitter = review.submittedById ? await User.findByPk(review.submittedById) : null;
  if (submitter) await sendEmail({ studioId: review.studioId, kind: 'review-decided', to: submitter.email, subject, text: `${text}\n\nOpen the review: ${reviewLink(slug, review.id)}` });
}

/**
 * An advisor approves the reviewed revision. Every note must be resolved or
 * accepted first. The approval records who, when and the content hash, and
 * never moves to a later revision.
 */
export async function approve(access: StudioAccess, actor: { userId: string; name: string }, reviewId: string) {
  const result = await sequelize.transaction(async (transaction) => {
    const review = await Review.findOne({ where: { id: reviewId, studioId: access.studio.id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!review) throw notFound('Review');
    if (review.state !== 'in_review') throw conflict(`This review is already ${review.state.replace('_', ' ')}.`);
    const open = await ReviewNote.count({ where: { reviewId, parentId: null, status: 'open' }, transaction });
    if (open) throw conflict(`${open} note${open === 1 ? ' is' : 's are'} still open: resolve or accept ${open === 1 ? 'it' : 'them'} before approving.`);
    const revision = await SceneRevision.findByPk(review.revisionId, { transaction });
    const approval = await Approval.create({ studioId: access.studio.id, sceneId: review.sceneId, revisionId: review.revisionId, reviewId, contentHash: revision!.contentHash, approvedById: actor.userId }, { transaction });
    await review.update({ state: 'approved', decidedById: actor.userId, decidedAt: new Date() }, { transaction });
    await audit({ studioId: access.studio.id, actorId: actor.userId, action: 'review.approved', targetType: 'revision', targetId: review.revisionId, data: { reviewId, contentHash: revision!.contentHash, revision: revision!.number } }, transaction);
    return { review, approval, revision: revision! };
  });
  const scene = await Scene.findByPk(result.review.sceneId);
  await notifySubmitter(result.review, access.studio.slug, `Approved: ${scene?.name}, revision ${result.revision.number}`, `${actor.name} approved revision ${result.revision.number} of "${scene?.name}" (content hash ${result.revision.contentHash.slice(0, 12)}). Final renders and deliveries of this revision are now possible.`);
  return result.approval;
}

/** An advisor asks for changes; the producer is e-mailed with the advisor's message. */
export async function requestChanges(access: StudioAccess, actor: { userId: string; name: string }, reviewId: string, message: string) {
  const review = await sequelize.transaction(async (transaction) => {
    const found = await Review.findOne({ where: { id: reviewId, studioId: access.studio.id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!found) throw notFound('Review');
    if (found.state !== 'in_review') throw conflict(`This review is already ${found.state.replace('_', ' ')}.`);
    await found.update({ state: 'changes_requested', decidedById: actor.userId, decidedAt: new Date(), decisionNote: message }, { transaction });
    await audit({ studioId: access.studio.id, actorId: actor.userId, action: 'review.changes_requested', targetType: 'review', targetId: reviewId, data: { message } }, transaction);
    return found;
  });
  const [scene, revision] = await Promise.all([Scene.findByPk(review.sceneId), SceneRevision.findByPk(review.revisionId)]);
  await notifySubmitter(review, access.studio.slug, `Changes requested: ${scene?.name}, revision ${revision?.number}`, `${actor.name} asks for changes to "${scene?.name}" (revision ${revision?.number}):\n\n${message}`);
  return review;
}

/** The review with its notes (threads), the revision and the diff from the last approved revision. */
export async function reviewDetail(studioId: string, reviewId: string) {
  const review = await findReview(studioId, reviewId);
  const [revision, scene, notes, approval] = await Promise.all([
    SceneRevision.findByPk(review.revisionId),
    Scene.findByPk(review.sceneId),
    ReviewNote.findAll({ where: { reviewId }, include: [{ model: User, as: 'author', attributes: ['name'] }], order: [['createdAt', 'ASC']] }),
    approvalOf(review.revisionId),
  ]);
  const approvedBefore = await lastApprovedRevision(review.sceneId, revision!.number);
  const noteView = (n: ReviewNote) => ({ id: n.id, parentId: n.parentId, author: (n as unknown as { author?: User }).author?.name ?? null, tau: n.tau, point: n.pointX === null ? null : { x: n.pointX, y: n.pointY }, body: n.body, status: n.status, createdAt: n.createdAt.toISOString() });
  return {
    review: { id: review.id, state: review.state, sceneId: review.sceneId, sceneName: scene!.name, revision: revision!.number, contentHash: revision!.contentHash, advisorIds: review.advisorIds, message: review.message, decisionNote: review.decisionNote, decidedAt: review.decidedAt?.toISOString() ?? null, createdAt: review.createdAt.toISOString() },
    approval: approval ? { contentHash: approval.contentHash, approvedById: approval.approvedById, at: approval.createdAt.toISOString() } : null,
    notes: notes.map(noteView),
    diffFromApproved: approvedBefore ? { from: approvedBefore.number, changes: diffSpecs(approvedBefore.spec, revision!.spec) } : null,
  };
}

export async function listReviews(studioId: string) {
  const reviews = await Review.findAll({ where: { studioId }, include: [{ model: Scene, as: 'scene', attributes: ['name'] }, { model: SceneRevision, as: 'revision', attributes: ['number'] }], order: [['createdAt', 'DESC']], limit: 200 });
  const openNotes = await ReviewNote.count({ where: { studioId, parentId: null, status: 'open' }, group: ['reviewId'] });
  const openBy = new Map(openNotes.map((c) => [c.reviewId as unknown as string, Number(c.count)]));
  return reviews.map((r) => {
    const rel = r as unknown as { scene: Scene; revision: SceneRevision };
    return { id: r.id, state: r.state, sceneId: r.sceneId, sceneName: rel.scene.name, revision: rel.revision.number, openNotes: openBy.get(r.id) ?? 0, createdAt: r.createdAt.toISOString(), decidedAt: r.decidedAt?.toISOString() ?? null };
  });
}
