import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Each project's velocity colour range (issue 17 item 6): every section of the project, on a page or
 * in a report, colours velocity on this range unless the viewer overrides it, so the same velocity
 * has the same colour everywhere. Defaults as DEFAULT_VELOCITY_COLOURS (shared/colour/velocity-scale.ts).
 */
export class ProjectVelocityColours1796470000000 implements MigrationInterface {
  name = 'ProjectVelocityColours1796470000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE projects ADD COLUMN velocity_colour_min real NOT NULL DEFAULT 200, ADD COLUMN velocity_colour_max real NOT NULL DEFAULT 5000`);
    await q.query(`ALTER TABLE projects ADD CONSTRAINT projects_velocity_colours CHECK (velocity_colour_min >= 50 AND velocity_colour_max <= 10000 AND velocity_colour_max > velocity_colour_min)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE projects DROP CONSTRAINT projects_velocity_colours, DROP COLUMN velocity_colour_min, DROP COLUMN velocity_colour_max`);
  }
}
