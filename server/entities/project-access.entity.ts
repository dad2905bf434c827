import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** A client reviewer's read access to one project (clients see nothing else). */
@Entity('project_access')
@Index(['projectId', 'userId'], { unique: true })
export class ProjectAccess {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  projectId: number;

  @Column({ type: 'int' })
  studioId: number;

  @Column({ type: 'int' })
  userId: number;

  @Column({ type: 'int', nullable: true })
  grantedById: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
