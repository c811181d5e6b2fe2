import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Results of expensive reads, computed once and kept: a model version's rasterised grid
 * (summary and gzip'd Float32 velocities, air NaN) and a pick-set revision's quality checks.
 * Both inputs are immutable, so a stored result never goes stale. Rows are written at save /
 * upload time, or on the first read for versions and revisions made before this table existed.
 */
export class StoredReads1764700000000 implements MigrationInterface {
  name = 'StoredReads1764700000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE model_rasters (
        model_id uuid PRIMARY KEY REFERENCES velocity_models(id) ON DELETE CASCADE,
        summary jsonb NOT NULL,
        velocity_gz bytea NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE pick_set_qc (
        pick_set_id uuid NOT NULL REFERENCES pick_sets(id) ON DELETE CASCADE,
        revision integer NOT NULL,
        qc jsonb NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (pick_set_id, revision)
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query('DROP TABLE IF EXISTS pick_set_qc');
    await q.query('DROP TABLE IF EXISTS model_rasters');
  }
}
