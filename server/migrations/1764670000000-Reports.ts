import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Run reports with their review workflow, and the mail every workflow step sends. */
export class Reports1764670000000 implements MigrationInterface {
  name = 'Reports1764670000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE reports (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        run_id uuid NOT NULL REFERENCES runs(id) ON DELETE CASCADE,
        project_id uuid NOT NULL REFERENCES projects(id) ON DELETE CASCADE,
        status text NOT NULL DEFAULT 'draft' CHECK (status IN ('draft', 'submitted', 'returned', 'approved', 'shared')),
        render_state text NOT NULL DEFAULT 'queued' CHECK (render_state IN ('queued', 'rendering', 'ready', 'failed')),
        render_error text NULL,
        options jsonb NOT NULL,
        pdf bytea NULL,
        pdf_rendered_at timestamptz NULL,
        reviewed_by uuid NULL REFERENCES users(id) ON DELETE SET NULL,
        created_by uuid NULL REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX reports_project_idx ON reports (project_id, created_at)`);
    await q.query(`
      CREATE TABLE mail_messages (
        id bigserial PRIMARY KEY,
        received_at timestamptz NOT NULL DEFAULT now(),
        mail_from text NOT NULL,
        recipients text[] NOT NULL,
        subject text NOT NULL,
        body text NOT NULL,
        raw bytea NOT NULL
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['mail_messages', 'reports']) await q.query(`DROP TABLE IF EXISTS ${t}`);
  }
}
