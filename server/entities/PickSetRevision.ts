import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';

export interface Exclusion {
  /** 0-based position of the pick in its file's data rows. */
  index: number;
  reason: string;
}

/** Exclusions over a pick set. Revision 0 is the file as uploaded; each change adds a revision. */
@Entity('pick_set_revisions')
export class PickSetRevision {
  @PrimaryColumn({ type: 'uuid', name: 'pick_set_id' })
  pickSetId: string;

  @PrimaryColumn({ type: 'integer' })
  number: number;

  @Column({ type: 'jsonb' })
  exclusions: Exclusion[];

  @Column({ type: 'text', default: '' })
  comment: string;

  @Column({ type: 'uuid', name: 'created_by', nullable: true })
  createdBy: string | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
