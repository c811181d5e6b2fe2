import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The consultancy's own name, address and logo for report covers (one row), and on reports: the
 * inputs frozen at creation/submission, and the approved PDF kept apart from the draft one.
 */
export class OrganisationAndReportSnapshots1764690000000 implements MigrationInterface {
  name = 'OrganisationAndReportSnapshots1764690000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE organisation (
        id smallint PRIMARY KEY DEFAULT 1 CHECK (id = 1),
        name text NOT NULL,
        address text NOT NULL DEFAULT '',
        logo bytea NULL,
        logo_type text NULL CHECK (logo_type IN ('image/png', 'image/jpeg')),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`ALTER TABLE reports ADD COLUMN snapshot jsonb NULL`);
    await q.query(`ALTER TABLE reports ADD COLUMN approved_pdf bytea NULL`);
    await q.query(`ALTER TABLE reports ADD COLUMN approved_pdf_rendered_at timestamptz NULL`);
    // Reports approved before this change: their last finished render was the one approval queued.
    await q.query(`
      UPDATE reports SET approved_pdf = pdf, approved_pdf_rendered_at = pdf_rendered_at
      WHERE status IN ('approved', 'shared') AND render_state = 'ready' AND pdf IS NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const c of ['approved_pdf_rendered_at', 'approved_pdf', 'snapshot']) await q.query(`ALTER TABLE reports DROP COLUMN IF EXISTS ${c}`);
    await q.query(`DROP TABLE IF EXISTS organisation`);
  }
}
