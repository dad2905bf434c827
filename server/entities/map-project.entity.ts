import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

export type MapPurpose = 'equal-area' | 'conformal' | 'reference' | 'equidistant';
export type ScaleBand = 'world' | 'continent' | 'country' | 'province' | 'city';
export type ProjectStatus = 'draft' | 'auditing' | 'in-review' | 'returned' | 'signed-off';

/** A map the studio is making, whose projection has to be chosen and signed off. */
@Entity('map_projects')
@Index(['studioId', 'updatedAt'])
export class MapProject {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  studioId: number;

  @Column({ type: 'varchar', length: 160 })
  title: string;

  @Column({ type: 'varchar', length: 160 })
  clientName: string;

  @Column({ type: 'varchar', length: 20 })
  purpose: MapPurpose;

  @Column({ type: 'varchar', length: 20 })
  scaleBand: ScaleBand;

  @Column({ type: 'text', nullable: true })
  notes: string | null;

  @Column({ type: 'varchar', length: 20, default: 'draft' })
  status: ProjectStatus;

  @Column({ type: 'int' })
  createdById: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)', onUpdate: 'CURRENT_TIMESTAMP(3)' })
  updatedAt: Date;
}
