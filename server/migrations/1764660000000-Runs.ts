import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Forward runs: what was solved (model version, pick set revision, order), their state, fields and residuals. */
export class Runs1764660000000 implements MigrationInterface {
  name = 'Runs1764660000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE runs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        line_id uuid NOT NULL REFERENCES survey_lines(id) ON DELETE CASCADE,
        model_id uuid NOT NULL REFERENCES velocity_models(id),
        pick_set_id uuid NOT NULL REFERENCES pick_sets(id),
        pick_set_revision integer NOT NULL,
        scheme_order smallint NOT NULL CHECK (scheme_order IN (1, 2)),
        status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'done', 'failed', 'cancelled')),
        shots_done integer NOT NULL DEFAULT 0,
        shots_total integer NOT NULL,
        error text NULL,
        stats jsonb NULL,
        attempts integer NOT NULL DEFAULT 0,
        created_by uuid NULL REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        started_at timestamptz NULL,
        finished_at timestamptz NULL
      )`);
    await q.query(`CREATE INDEX runs_line_idx ON runs (line_id, created_at)`);
    // One travel-time field per shot: Float32 little-endian, deflated.
    await q.query(`
      CREATE TABLE run_fields (
        run_id uuid NOT NULL REFERENCES runs(id) ON DELETE CASCADE,
        shot_id text NOT NULL,
        source_x double precision NOT NULL,
        source_z double precision NOT NULL,
        data bytea NOT NULL,
        PRIMARY KEY (run_id, shot_id)
      )`);
    // One row per pick (seconds inside); ray: Float32 x,z pairs from receiver to source.
    await q.query(`
      CREATE TABLE run_residuals (
        run_id uuid NOT NULL REFERENCES runs(id) ON DELETE CASCADE,
        pick_index integer NOT NULL,
        shot_id text NOT NULL,
        receiver_x double precision NOT NULL,
        receiver_z double precision NOT NULL,
        observed_s double precision NOT NULL,
        computed_s double precision NOT NULL,
        residual_s double precision NOT NULL,
        normalised double precision NOT NULL,
        sigma_s double precision NOT NULL,
        excluded boolean NOT NULL,
        ray bytea NULL,
        PRIMARY KEY (run_id, pick_index)
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['run_residuals', 'run_fields', 'runs']) await q.query(`DROP TABLE IF EXISTS ${t}`);
  }
}
