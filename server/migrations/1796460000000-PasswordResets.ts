import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * One-time links to set a new password (issue 17 item 3): an administrator starts a reset, the
 * account's owner gets the link by e-mail. Only a hash of the link's token is kept; a link works once,
 * for 24 hours, and a newer link for the same account replaces it.
 */
export class PasswordResets1796460000000 implements MigrationInterface {
  name = 'PasswordResets1796460000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE password_resets (
        token_hash text PRIMARY KEY,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        created_by uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        used_at timestamptz
      )`);
    await q.query(`CREATE INDEX password_resets_user ON password_resets (user_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE password_resets`);
  }
}
