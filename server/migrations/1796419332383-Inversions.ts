import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Inversions (issue 11): what was inverted (pick-set revision, start, grid, every setting), its
 * state, one row per stored iteration (the resume checkpoint) and the final result. Node arrays
 * are bytea: Float32 little-endian (Int32 for hits, Float64 for computed times), deflated.
 */
export class Inversions1796419332383 implements MigrationInterface {
  name = 'Inversions1796419332383';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE inversions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        line_id uuid NOT NULL REFERENCES survey_lines(id) ON DELETE CASCADE,
        pick_set_id uuid NOT NULL REFERENCES pick_sets(id),
        pick_set_revision integer NOT NULL,
        start_kind text NOT NULL CHECK (start_kind IN ('gradient', 'model')),
        start_model_id uuid NULL REFERENCES velocity_models(id),
        start_spacing double precision NULL,
        -- the fitted gradient v = v0 + k·depth, once the worker has fitted it
        start_v0 double precision NULL,
        start_k double precision NULL,
        grid jsonb NOT NULL,
        -- ground surface polyline [[x, z], …]; NULL: the top row of the grid
        surface jsonb NULL,
        settings jsonb NOT NULL,
        label text NOT NULL DEFAULT '',
        status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'done', 'failed', 'cancelled')),
        shots integer NOT NULL,
        picks integer NOT NULL,
        -- the rest of the resume checkpoint (the last iteration row holds history and velocity)
        next_smoothing double precision NULL,
        scale double precision NULL,
        error text NULL,
        stats jsonb NULL,
        attempts integer NOT NULL DEFAULT 0,
        saved_model_id uuid NULL REFERENCES velocity_models(id) ON DELETE SET NULL,
        created_by uuid NULL REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        started_at timestamptz NULL,
        finished_at timestamptz NULL,
        CHECK ((start_kind = 'model') = (start_model_id IS NOT NULL))
      )`);
    await q.query(`CREATE INDEX inversions_line_idx ON inversions (line_id, created_at)`);
    await q.query(`
      CREATE TABLE inversion_iterations (
        inversion_id uuid NOT NULL REFERENCES inversions(id) ON DELETE CASCADE,
        iteration integer NOT NULL,
        chi2 double precision NOT NULL,
        rms_ms double precision NOT NULL,
        smoothing double precision NULL,
        seconds double precision NOT NULL,
        velocity bytea NOT NULL,
        PRIMARY KEY (inversion_id, iteration)
      )`);
    await q.query(`
      CREATE TABLE inversion_results (
        inversion_id uuid PRIMARY KEY REFERENCES inversions(id) ON DELETE CASCADE,
        velocity bytea NOT NULL,
        coverage bytea NOT NULL,
        hits bytea NOT NULL,
        doi bytea NOT NULL,
        computed bytea NOT NULL,
        -- placed sources [{ shotId, x, z }]
        shots jsonb NOT NULL,
        checkerboard jsonb NULL,
        checker_true bytea NULL,
        checker_recovered bytea NULL
      )`);
    // One row per pick against the final model, the shape of run_residuals (without rays).
    await q.query(`
      CREATE TABLE inversion_residuals (
        inversion_id uuid NOT NULL REFERENCES inversions(id) ON DELETE CASCADE,
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
        PRIMARY KEY (inversion_id, pick_index)
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['inversion_residuals', 'inversion_results', 'inversion_iterations', 'inversions']) await q.query(`DROP TABLE IF EXISTS ${t}`);
  }
}
