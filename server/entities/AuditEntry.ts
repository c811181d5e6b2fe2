import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** Who did what to which object, and when. Written by services, never edited. */
@Entity('audit_log')
export class AuditEntry {
  @PrimaryGeneratedColumn('increment', { type: 'bigint' })
  id: string;

  @CreateDateColumn({ type: 'timestamptz' })
  at: Date;

  /** Null for actions without a signed-in user (e.g. a failed sign-in). */
  @Column({ type: 'uuid', name: 'actor_id', nullable: true })
  actorId: string | null;

  /** e.g. 'user.create', 'project.member.add', 'auth.login'. */
  @Column({ type: 'text' })
  action: string;

  @Column({ type: 'text', name: 'object_type' })
  objectType: string;

  @Column({ type: 'text', name: 'object_id', nullable: true })
  objectId: string | null;

  @Index()
  @Column({ type: 'uuid', name: 'project_id', nullable: true })
  projectId: string | null;

  @Column({ type: 'jsonb', default: {} })
  detail: object;
}
