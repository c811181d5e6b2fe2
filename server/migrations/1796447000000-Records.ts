import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Field records on a line (issue 12): the original file bytes, exactly as uploaded, with the headers
 * read from them; and which records a pick set was picked on.
 */
export class Records1796447000000 implements MigrationInterface {
  name = 'Records1796447000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE records (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        line_id uuid NOT NULL REFERENCES survey_lines(id) ON DELETE CASCADE,
        file_name text NOT NULL,
        bytes bytea NOT NULL,
        size_bytes integer NOT NULL,
        sha256 text NOT NULL,
        format text NOT NULL CHECK (format IN ('seg2', 'segy')),
        revision text NOT NULL,
        header jsonb NOT NULL,
        shot_id text NOT NULL,
        source_x double precision,
        source_z double precision,
        source_from text NOT NULL CHECK (source_from IN ('header', 'set', 'none')),
        receivers_from text NOT NULL CHECK (receivers_from IN ('header', 'stations', 'none')),
        uploaded_by uuid REFERENCES users(id),
        uploaded_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (line_id, sha256)
      )`);
    await q.query(`CREATE INDEX records_line ON records (line_id, uploaded_at DESC)`);
    await q.query(`
      CREATE TABLE pick_set_records (
        pick_set_id uuid NOT NULL REFERENCES pick_sets(id) ON DELETE CASCADE,
        record_id uuid NOT NULL REFERENCES records(id),
        PRIMARY KEY (pick_set_id, record_id)
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE pick_set_records`);
    await q.query(`DROP TABLE records`);
  }
}
