import type { EntityManager } from 'typeorm';
import { AuditEntry } from '../entities';

export interface AuditInput {
  actorId: string | null;
  action: string;
  objectType: string;
  objectId?: string | null;
  projectId?: string | null;
  detail?: Record<string, unknown>;
}

/** Records one action; call it inside the same transaction as the change it describes. */
export async function audit(em: EntityManager, a: AuditInput): Promise<void> {
  await em.insert(AuditEntry, {
    actorId: a.actorId,
    action: a.action,
    objectType: a.objectType,
    objectId: a.objectId ?? null,
    projectId: a.projectId ?? null,
    detail: a.detail ?? {},
  });
}
