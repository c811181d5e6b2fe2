import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Ensembles of inversions (issue 20): what an ensemble varies and how many members it has, one row
 * per member (its plan, its state, the worker that took it, and once done its section arrays), and
 * the combined result. Node arrays are packed bytea as for inversions (server/db/packed-arrays.ts).
 */
export class Ensembles1796490000000 implements MigrationInterface {
  name = 'Ensembles1796490000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE ensembles (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        inversion_id uuid NOT NULL REFERENCES inversions(id) ON DELETE CASCADE,
        line_id uuid NOT NULL REFERENCES survey_lines(id) ON DELETE CASCADE,
        members integer NOT NULL CHECK (members BETWEEN 2 AND 256),
        seed bigint NOT NULL CHECK (seed BETWEEN 0 AND 4294967295),
        -- { start: boolean, smoothing: boolean, picks: 'none' | 'sigma' | 'bootstrap' }
        variation jsonb NOT NULL,
        -- the rock velocity v*: one value (min = max) or a range each member draws from
        rock_velocity_min double precision NOT NULL,
        rock_velocity_max double precision NOT NULL,
        coverage_threshold double precision NOT NULL,
        label text NOT NULL DEFAULT '',
        status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'done', 'failed', 'cancelled')),
        error text NULL,
        stats jsonb NULL,
        created_by uuid NULL REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        started_at timestamptz NULL,
        finished_at timestamptz NULL,
        CHECK (rock_velocity_min <= rock_velocity_max)
      )`);
    await q.query(`CREATE INDEX ensembles_inversion_idx ON ensembles (inversion_id, created_at)`);
    await q.query(`
      CREATE TABLE ensemble_members (
        ensemble_id uuid NOT NULL REFERENCES ensembles(id) ON DELETE CASCADE,
        index integer NOT NULL,
        plan jsonb NOT NULL,
        status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'running', 'done', 'failed', 'cancelled')),
        attempts integer NOT NULL DEFAULT 0,
        worker text NULL,
        chi2 double precision NULL,
        rms_ms double precision NULL,
        iterations integer NULL,
        seconds double precision NULL,
        velocity bytea NULL,
        coverage bytea NULL,
        doi bytea NULL,
        error text NULL,
        started_at timestamptz NULL,
        finished_at timestamptz NULL,
        PRIMARY KEY (ensemble_id, index)
      )`);
    await q.query(`
      CREATE TABLE ensemble_results (
        ensemble_id uuid PRIMARY KEY REFERENCES ensembles(id) ON DELETE CASCADE,
        used integer NOT NULL,
        excluded integer NOT NULL,
        covering bytea NOT NULL,
        mean bytea NOT NULL,
        std bytea NOT NULL,
        probability bytea NOT NULL,
        -- per station [{ x, resolved, median, p5, p95 }]
        bands jsonb NOT NULL
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const t of ['ensemble_results', 'ensemble_members', 'ensembles']) await q.query(`DROP TABLE IF EXISTS ${t}`);
  }
}
