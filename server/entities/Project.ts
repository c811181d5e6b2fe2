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

  /** The project's velocity colour range (m/s), used by every section unless a viewer overrides it. */
  @Column({ type: 'real', name: 'velocity_colour_min', default: 200 })
  velocityColourMin: number;

  @Column({ type: 'real', name: 'velocity_colour_max', default: 5000 })
  velocityColourMax: number;

  /** EPSG code of the project's coordinate reference system (projected, metres); null until set. */
  @Column({ type: 'integer', name: 'crs_epsg', nullable: true })
  crsEpsg: number | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;
}
