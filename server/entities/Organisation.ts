import { Column, Entity, PrimaryColumn, UpdateDateColumn } from 'typeorm';

/** The consultancy using this installation: one row (id 1), printed on every report. */
@Entity('organisation')
export class Organisation {
  @PrimaryColumn({ type: 'smallint' })
  id: number;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text', default: '' })
  address: string;

  @Column({ type: 'bytea', nullable: true, select: false })
  logo: Buffer | null;

  @Column({ type: 'text', name: 'logo_type', nullable: true })
  logoType: 'image/png' | 'image/jpeg' | null;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
