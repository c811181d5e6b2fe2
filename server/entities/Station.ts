import { Column, Entity, PrimaryColumn } from 'typeorm';

/** One geophone station of a line; the table is replaced whole on each save. */
@Entity('stations')
export class Station {
  @PrimaryColumn({ type: 'uuid', name: 'line_id' })
  lineId: string;

  @PrimaryColumn({ type: 'integer' })
  station: number;

  /** Chainage along the line, m. */
  @Column({ type: 'double precision' })
  x: number;

  /** Ground elevation, m. */
  @Column({ type: 'double precision' })
  z: number;

  /** Easting and northing (m) in the project's coordinate reference system; null in chainage only. */
  @Column({ type: 'double precision', nullable: true })
  easting: number | null;

  @Column({ type: 'double precision', nullable: true })
  northing: number | null;
}
