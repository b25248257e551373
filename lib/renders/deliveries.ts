import 'server-only';
import { literal, Op } from 'sequelize';
import { notFound, conflict } from '@/lib/errors';
import type { Role } from '@/lib/auth/roles';
import { audit } from '@/lib/studio/audit';
import { Delivery, Frame } from '@/models';

export type DeliveryView = { id: string; renderId: string; scene: string; show: string; revision: number; approved: boolean; frames: number; frameRate: number; resolution: string; projection: string; photosensitivity: string; status: string; loadedAt: string | null; createdAt: string };

function view(d: Delivery): DeliveryView {
  const m = d.manifest;
  return {
    id: d.id, renderId: d.renderJobId, scene: m.scene.name, show: m.scene.show, revision: m.revision.number, approved: m.revision.approved,
    frames: m.frames.length, frameRate: m.frameRate, resolution: `${m.resolution.width}x${m.resolution.height}`, projection: String(m.projection.kind),
    photosensitivity: String((m.photosensitivity as { verdict?: string })?.verdict ?? 'unknown'), status: d.status, loadedAt: d.loadedAt?.toISOString() ?? null, createdAt: d.createdAt.toISOString(),
  };
}

/**
 * Operators only ever see packages of approved revisions (product.md flow 3:
 * deliveries come only from approved revisions); others see drafts too,
 * marked as such.
 */
const visibleTo = (role: Role) => (role === 'operator' ? { [Op.and]: [literal("(manifest->'revision'->>'approved')::boolean = true")] } : {});

export async function listDeliveries(studioId: string, role: Role): Promise<DeliveryView[]> {
  return (await Delivery.findAll({ where: { studioId, ...visibleTo(role) }, order: [['createdAt', 'DESC']] })).map(view);
}

export async function findDelivery(studioId: string, deliveryId: string, role: Role): Promise<Delivery> {
  const delivery = await Delivery.findOne({ where: { id: deliveryId, studioId, ...visibleTo(role) } });
  if (!delivery) throw notFound('Delivery');
  return delivery;
}

export async function deliveryDetail(studioId: string, deliveryId: string, role: Role) {
  const delivery = await findDelivery(studioId, deliveryId, role);
  return { delivery: view(delivery), manifest: delivery.manifest };
}

/** Object keys of a delivery's frames, in manifest order. */
export async function deliveryObjectKeys(delivery: Delivery): Promise<string[]> {
  const frames = await Frame.findAll({ where: { renderJobId: delivery.renderJobId }, attributes: ['index', 'objectKey'] });
  const byIndex = new Map(frames.map((f) => [f.index, f.objectKey]));
  return delivery.manifest.frames.map((f) => byIndex.get(f.index)!);
}

export async function markLoaded(studioId: string, actorId: string, deliveryId: string, role: Role): Promise<DeliveryView> {
  const delivery = await findDelivery(studioId, deliveryId, role);
  if (delivery.status === 'loaded') throw conflict('This delivery is already marked as loaded.');
  await delivery.update({ status: 'loaded', loadedAt: new Date(), loadedById: actorId });
  await audit({ studioId, actorId, action: 'delivery.loaded', targetType: 'delivery', targetId: deliveryId });
  return view(delivery);
}
