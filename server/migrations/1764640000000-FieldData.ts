import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Station geometry, uploaded pick files with their parsed picks, and exclusion revisions. */
export class FieldData1764640000000 implements MigrationInterface {
  name = 'FieldData1764640000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE stations (
        line_id uuid NOT NULL REFERENCES survey_lines(id) ON DELETE CASCADE,
        station integer NOT NULL CHECK (station > 0),
        x double precision NOT NULL,
        z double precision NOT NULL,
        PRIMARY KEY (line_id, station)
      )`);
    await q.query(`
      CREATE TABLE pick_sets (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        line_id uuid NOT NULL REFERENCES survey_lines(id) ON DELETE CASCADE,
        file_name text NOT NULL,
        size_bytes integer NOT NULL,
        original bytea NOT NULL,
        shot_count integer NOT NULL,
        pick_count integer NOT NULL,
        created_by uuid NULL REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX pick_sets_line_idx ON pick_sets (line_id, created_at)`);
    // SI inside: seconds and metres. idx is the pick's 0-based position among the file's data rows.
    await q.query(`
      CREATE TABLE picks (
        pick_set_id uuid NOT NULL REFERENCES pick_sets(id) ON DELETE CASCADE,
        idx integer NOT NULL,
        file_line integer NOT NULL,
        shot_id text NOT NULL,
        source_x double precision NOT NULL,
        source_z double precision NULL,
        receiver_x double precision NOT NULL,
        receiver_z double precision NULL,
        time_s double precision NOT NULL CHECK (time_s >= 0),
        sigma_s double precision NOT NULL CHECK (sigma_s > 0),
        PRIMARY KEY (pick_set_id, idx)
      )`);
    await q.query(`
      CREATE TABLE pick_set_revisions (
        pick_set_id uuid NOT NULL REFERENCES pick_sets(id) ON DELETE CASCADE,
        number integer NOT NULL CHECK (number >= 0),
        exclusions jsonb NOT NULL DEFAULT '[]',
        comment text NOT NULL DEFAULT '',
        created_by uuid NULL REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (pick_set_id, number)
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['pick_set_revisions', 'picks', 'pick_sets', 'stations']) await q.query(`DROP TABLE IF EXISTS ${t}`);
  }
}
