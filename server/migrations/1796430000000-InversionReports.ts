import type { MigrationInterface, QueryRunner } from 'typeorm';

/** A report is made from a forward run or from an inversion: exactly one of the two. */
export class InversionReports1796430000000 implements MigrationInterface {
  name = 'InversionReports1796430000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE reports ALTER COLUMN run_id DROP NOT NULL`);
    await q.query(`ALTER TABLE reports ADD COLUMN inversion_id uuid REFERENCES inversions(id)`);
    await q.query(`ALTER TABLE reports ADD CONSTRAINT reports_one_source CHECK ((run_id IS NULL) <> (inversion_id IS NULL))`);
    await q.query(`CREATE INDEX reports_inversion_id ON reports (inversion_id) WHERE inversion_id IS NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DELETE FROM reports WHERE inversion_id IS NOT NULL`);
    await q.query(`ALTER TABLE reports DROP CONSTRAINT reports_one_source`);
    await q.query(`ALTER TABLE reports DROP COLUMN inversion_id`);
    await q.query(`ALTER TABLE reports ALTER COLUMN run_id SET NOT NULL`);
  }
}
