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
}
