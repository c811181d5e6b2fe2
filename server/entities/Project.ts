import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

import type { ProjectStatus } from '../../shared/schemas/projects';

@Entity('projects')
export class Project {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  site: string;

  @Column({ type: 'text', name: 'client_organisation' })
  clientOrganisation: string;

  @Column({ type: 'text', default: 'active' })
  status: ProjectStatus;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
