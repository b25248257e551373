import 'server-only';
import type { Transaction } from 'sequelize';
import { AuditEvent } from '@/models';

/** Appends one audit event (inside the caller's transaction when given). */
export async function audit(
  event: { studioId: string | null; actorId: string | null; action: string; targetType?: string; targetId?: string; data?: Record<string, unknown> },
  transaction?: Transaction,
): Promise<void> {
  await AuditEvent.create(
    { studioId: event.studioId, actorId: event.actorId, action: event.action, targetType: event.targetType ?? null, targetId: event.targetId ?? null, data: event.data ?? {} },
    { transaction },
  );
}
