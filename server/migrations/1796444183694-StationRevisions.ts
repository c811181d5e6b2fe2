import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Every station table that a save replaced, kept so it can be restored (issue 17: no silent loss). */
export class StationRevisions1796444183694 implements MigrationInterface {
  name = 'StationRevisions1796444183694';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE station_revisions (
        line_id uuid NOT NULL REFERENCES survey_lines(id) ON DELETE CASCADE,
        number integer NOT NULL CHECK (number >= 1),
        stations jsonb NOT NULL,
        station_count integer NOT NULL,
        replaced_by uuid REFERENCES users(id),
        replaced_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (line_id, number)
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE station_revisions`);
  }
}
