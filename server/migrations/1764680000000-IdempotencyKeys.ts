import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The first answer to each Idempotency-Key, so a repeated submission gets it again instead of a second object. */
export class IdempotencyKeys1764680000000 implements MigrationInterface {
  name = 'IdempotencyKeys1764680000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE idempotency_keys (
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        route text NOT NULL,
        key text NOT NULL,
        status integer NULL,
        body jsonb NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (user_id, route, key)
      )`);
    await q.query(`CREATE INDEX idempotency_keys_age_idx ON idempotency_keys (created_at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS idempotency_keys`);
  }
}
