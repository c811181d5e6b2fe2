import { Router } from 'express';
import { dataSource } from '../db/dataSource';
import { authorize } from '../policies/authorize';
import { projectFromParam } from '../policies/scopes';

export function adminRouter(): Router {
  const r = Router();

  // Mail the local sink received, newest first.
  r.get('/outbox', authorize('outbox.read'), async (_req, res) => {
    const rows = await dataSource.query('SELECT id, received_at, mail_from, recipients, subject, body FROM mail_messages ORDER BY id DESC LIMIT 500');
    res.json(rows.map((m: Record<string, never>) => ({ id: Number(m.id), receivedAt: m.received_at, from: m.mail_from, to: m.recipients, subject: m.subject, body: m.body })));
  });

  // The project's audit trail: who did what, to which object, when (newest first).
  r.get('/projects/:projectId/audit', authorize('project.audit.read', projectFromParam), async (req, res) => {
    const rows = await dataSource.query(
      `SELECT a.id, a.at, a.action, a.object_type, a.object_id, a.detail, u.name AS actor, u.email AS actor_email
       FROM audit_log a LEFT JOIN users u ON u.id = a.actor_id WHERE a.project_id = $1 ORDER BY a.id DESC LIMIT 1000`,
      [req.access!.projectId],
    );
    res.json(rows.map((a: Record<string, never>) => ({
      id: Number(a.id), at: a.at, action: a.action, objectType: a.object_type, objectId: a.object_id, detail: a.detail, actor: a.actor, actorEmail: a.actor_email,
    })));
  });

  return r;
}
