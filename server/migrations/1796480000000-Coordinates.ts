import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Real-world coordinates (issue 19): a project's coordinate reference system (EPSG code; null until
 * set) and each station's easting and northing in it (null when the line is in chainage only).
 */
export class Coordinates1796480000000 implements MigrationInterface {
  name = 'Coordinates1796480000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE projects ADD COLUMN crs_epsg integer`);
    await q.query(`ALTER TABLE stations ADD COLUMN easting double precision, ADD COLUMN northing double precision`);
    await q.query(`ALTER TABLE stations ADD CONSTRAINT stations_coordinates_paired CHECK ((easting IS NULL) = (northing IS NULL))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE stations DROP CONSTRAINT stations_coordinates_paired, DROP COLUMN easting, DROP COLUMN northing`);
    await q.query(`ALTER TABLE projects DROP COLUMN crs_epsg`);
  }
}
