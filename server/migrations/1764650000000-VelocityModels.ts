import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Immutable, numbered versions of velocity models per survey line. */
export class VelocityModels1764650000000 implements MigrationInterface {
  name = 'VelocityModels1764650000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE velocity_models (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        line_id uuid NOT NULL REFERENCES survey_lines(id) ON DELETE CASCADE,
        name text NOT NULL,
        version integer NOT NULL CHECK (version >= 1),
        comment text NOT NULL DEFAULT '',
        based_on uuid NULL REFERENCES velocity_models(id),
        content jsonb NOT NULL,
        nx integer NOT NULL,
        nz integer NOT NULL,
        created_by uuid NULL REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (line_id, name, version)
      )`);
    // Versions are immutable: the database refuses updates as well as the API.
    await q.query(`
      CREATE FUNCTION velocity_models_immutable() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN RAISE EXCEPTION 'velocity model versions are immutable'; END $$`);
    await q.query(`CREATE TRIGGER velocity_models_no_update BEFORE UPDATE ON velocity_models FOR EACH ROW EXECUTE FUNCTION velocity_models_immutable()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE IF EXISTS velocity_models');
    await q.query('DROP FUNCTION IF EXISTS velocity_models_immutable()');
  }
}
