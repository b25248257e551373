import 'server-only';
import { Op, type Transaction } from 'sequelize';
import { conflict, notFound } from '@/lib/errors';
import { Scene, SceneRevision, Show, sequelize } from '@/models';
import { audit } from '@/lib/studio/audit';
import { contentHash } from './hash';
import { diffSpecs } from './diff';
import { sceneSpecSchema, type SceneSpec, type SceneSpecInput } from './schema';
import { slugify } from './slug';

export type ShowView = { id: string; name: string; archived: boolean; sceneCount: number; createdAt: string };
export type SceneView = { id: string; showId: string; name: string; slug: string; archived: boolean; latestRevision: number; updatedAt: string };
export type RevisionView = { id: string; number: number; basedOn: number | null; contentHash: string; message: string | null; authorId: string | null; createdAt: string };

const showView = (s: Show, sceneCount: number): ShowView => ({ id: s.id, name: s.name, archived: s.archivedAt !== null, sceneCount, createdAt: s.createdAt.toISOString() });
const sceneView = (s: Scene): SceneView => ({ id: s.id, showId: s.showId, name: s.name, slug: s.slug, archived: s.archivedAt !== null, latestRevision: s.latestRevisionNumber, updatedAt: s.updatedAt.toISOString() });
const revisionView = (r: SceneRevision): RevisionView => ({ id: r.id, number: r.number, basedOn: r.basedOnNumber, contentHash: r.contentHash, message: r.message, authorId: r.authorId, createdAt: r.createdAt.toISOString() });

export async function listShows(studioId: string, includeArchived: boolean): Promise<ShowView[]> {
  const shows = await Show.findAll({ where: { studioId, ...(includeArchived ? {} : { archivedAt: null }) }, order: [['name', 'ASC']] });
  const counts = await Scene.count({ where: { studioId, archivedAt: null }, group: ['showId'] });
  const byShow = new Map(counts.map((c) => [c.showId as unknown as string, Number(c.count)]));
  return shows.map((s) => showView(s, byShow.get(s.id) ?? 0));
}

export async function findShow(studioId: string, showId: string): Promise<Show> {
  const show = await Show.findOne({ where: { id: showId, studioId } });
  if (!show) throw notFound('Show');
  return show;
}

export async function createShow(studioId: string, actorId: string, name: string): Promise<ShowView> {
  const show = await sequelize.transaction(async (transaction) => {
    const created = await Show.create({ studioId, name, archivedAt: null, createdById: actorId }, { transaction });
    await audit({ studioId, actorId, action: 'show.created', targetType: 'show', targetId: created.id, data: { name } }, transaction);
    return created;
  });
  return showView(show, 0);
}

export async function updateShow(studioId: string, actorId: string, showId: string, change: { name?: string; archived?: boolean }): Promise<ShowView> {
  const show = await findShow(studioId, showId);
  await sequelize.transaction(async (transaction) => {
    await show.update({ ...(change.name !== undefined ? { name: change.name } : {}), ...(change.archived !== undefined ? { archivedAt: change.archived ? new Date() : null } : {}) }, { transaction });
    await audit({ studioId, actorId, action: 'show.updated', targetType: 'show', targetId: show.id, data: change }, transaction);
  });
  return showView(show, await Scene.count({ where: { showId: show.id, archivedAt: null } }));
}

export async function listScenes(studioId: string, showId: string, includeArchived: boolean): Promise<SceneView[]> {
  await findShow(studioId, showId);
  const scenes = await Scene.findAll({ where: { studioId, showId, ...(includeArchived ? {} : { archivedAt: null }) }, order: [['position', 'ASC'], ['name', 'ASC']] });
  return scenes.map(sceneView);
}

export async function findScene(studioId: string, sceneId: string): Promise<Scene> {
  const scene = await Scene.findOne({ where: { id: sceneId, studioId } });
  if (!scene) throw notFound('Scene');
  return scene;
}

async function uniqueSlug(showId: string, name: string, transaction: Transaction): Promise<string> {
  const base = slugify(name);
  const taken = new Set((await Scene.findAll({ where: { showId, slug: { [Op.like]: `${base}%` } }, attributes: ['slug'], transaction })).map((s) => s.slug));
  if (!taken.has(base)) return base;
  for (let i = 2; ; i++) if (!taken.has(`${base}-${i}`)) return `${base}-${i}`;
}

/** Creates a scene with its first revision (validated spec). */
export async function createScene(studioId: string, actorId: string, showId: string, name: string, specInput: SceneSpecInput) {
  const show = await findShow(studioId, showId);
  if (show.archivedAt) throw conflict('This show is archived; restore it before adding scenes.');
  const spec = sceneSpecSchema.parse(specInput);
  return sequelize.transaction(async (transaction) => {
    const position = await Scene.count({ where: { showId }, transaction });
    const scene = await Scene.create({ studioId, showId, name, slug: await uniqueSlug(showId, name, transaction), position, archivedAt: null, latestRevisionNumber: 1, createdById: actorId }, { transaction });
    const revision = await SceneRevision.create({ studioId, sceneId: scene.id, number: 1, basedOnNumber: null, spec, contentHash: contentHash(spec), message: 'First version', authorId: actorId }, { transaction });
    await audit({ studioId, actorId, action: 'scene.created', targetType: 'scene', targetId: scene.id, data: { name, showId } }, transaction);
    return { scene: sceneView(scene), revision: revisionView(revision) };
  });
}

export async function updateScene(studioId: string, actorId: string, sceneId: string, change: { name?: string; archived?: boolean }): Promise<SceneView> {
  const scene = await findScene(studioId, sceneId);
  await sequelize.transaction(async (transaction) => {
    await scene.update({ ...(change.name !== undefined ? { name: change.name } : {}), ...(change.archived !== undefined ? { archivedAt: change.archived ? new Date() : null } : {}) }, { transaction });
    await audit({ studioId, actorId, action: 'scene.updated', targetType: 'scene', targetId: scene.id, data: change }, transaction);
  });
  return sceneView(scene);
}

/**
 * Saves an edit as a new revision. Two producers saving at once both get
 * their own revision (the scene row is locked to number them); `basedOn`
 * records what each started from, and `superseded` tells the author that
 * someone else saved in between, so nothing is lost silently.
 */
export async function saveRevision(studioId: string, actorId: string, sceneId: string, input: { basedOn: number; spec: SceneSpec; message?: string }) {
  return sequelize.transaction(async (transaction) => {
    const scene = await Scene.findOne({ where: { id: sceneId, studioId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!scene) throw notFound('Scene');
    if (input.basedOn < 1 || input.basedOn > scene.latestRevisionNumber) {
      throw conflict(`basedOn must name an existing revision of this scene (1 to ${scene.latestRevisionNumber}).`);
    }
    const number = scene.latestRevisionNumber + 1;
    const revision = await SceneRevision.create(
      { studioId, sceneId, number, basedOnNumber: input.basedOn, spec: input.spec, contentHash: contentHash(input.spec), message: input.message ?? null, authorId: actorId },
      { transaction },
    );
    await scene.update({ latestRevisionNumber: number }, { transaction });
    await audit({ studioId, actorId, action: 'scene.revised', targetType: 'scene', targetId: sceneId, data: { number, basedOn: input.basedOn } }, transaction);
    return { revision: revisionView(revision), superseded: input.basedOn !== number - 1 };
  });
}

export async function listRevisions(studioId: string, sceneId: string): Promise<RevisionView[]> {
  await findScene(studioId, sceneId);
  const rows = await SceneRevision.findAll({ where: { studioId, sceneId }, order: [['number', 'DESC']], attributes: { exclude: ['spec'] } });
  return rows.map(revisionView);
}

export async function findRevision(studioId: string, sceneId: string, number: number): Promise<SceneRevision> {
  const revision = await SceneRevision.findOne({ where: { studioId, sceneId, number } });
  if (!revision) throw notFound(`Revision ${number}`);
  return revision;
}

export async function getRevision(studioId: string, sceneId: string, number: number) {
  const revision = await findRevision(studioId, sceneId, number);
  return { ...revisionView(revision), spec: revision.spec };
}

export async function diffRevisions(studioId: string, sceneId: string, from: number, to: number) {
  const [a, b] = await Promise.all([findRevision(studioId, sceneId, from), findRevision(studioId, sceneId, to)]);
  return { from, to, sameContent: a.contentHash === b.contentHash, changes: diffSpecs(a.spec, b.spec) };
}
