import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '../../shared/api/roles.js';

/** A message in a project's thread, seen by the studio and the project's reviewers. */
@Entity('project_comments')
@Index(['projectId', 'createdAt'])
export class ProjectComment {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  projectId: number;

  @Column({ type: 'int' })
  studioId: number;

  @Column({ type: 'int' })
  authorId: number;

  /** Name and role as they were when the comment was written. */
  @Column({ type: 'varchar', length: 120 })
  authorName: string;

  @Column({ type: 'varchar', length: 20 })
  authorRole: Role;

  @Column({ type: 'text' })
  body: string;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
