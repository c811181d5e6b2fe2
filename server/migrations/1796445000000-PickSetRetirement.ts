import type { MigrationInterface, QueryRunner } from 'typeorm';

/** A mistaken pick set can be retired: hidden from the choices for new work, kept for what used it. */
export class PickSetRetirement1796445000000 implements MigrationInterface {
  name = 'PickSetRetirement1796445000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE pick_sets ADD COLUMN retired_at timestamptz, ADD COLUMN retired_by uuid REFERENCES users(id), ADD COLUMN retire_reason text`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE pick_sets DROP COLUMN retired_at, DROP COLUMN retired_by, DROP COLUMN retire_reason`);
  }
}
