import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Boreholes and trial pits on a line (issue 13): position, ground, water level and the logged contacts. */
export class Boreholes1796450000000 implements MigrationInterface {
  name = 'Boreholes1796450000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE boreholes (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        line_id uuid NOT NULL REFERENCES survey_lines(id) ON DELETE CASCADE,
        name text NOT NULL,
        kind text NOT NULL CHECK (kind IN ('borehole', 'trial_pit')),
        x double precision NOT NULL,
        ground_z double precision,
        water_depth double precision,
        contacts jsonb NOT NULL,
        note text NOT NULL DEFAULT '',
        created_by uuid REFERENCES users(id),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (line_id, name)
      )`);
    await q.query(`CREATE INDEX boreholes_line ON boreholes (line_id, x)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE boreholes`);
  }
}
