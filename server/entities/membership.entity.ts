import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, type Relation } from 'typeorm';
import type { Role } from '../../shared/api/roles.js';
import { Studio } from './studio.entity.js';
import { User } from './user.entity.js';

/** A user's role in a studio. Deactivated memberships keep their history but cannot sign in. */
@Entity('memberships')
@Index(['userId', 'studioId'], { unique: true })
export class Membership {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int' })
  userId: number;

  @ManyToOne(() => User, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user: Relation<User>;

  @Column({ type: 'int' })
  studioId: number;

  @ManyToOne(() => Studio, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'studioId' })
  studio: Relation<Studio>;

  @Column({ type: 'varchar', length: 20 })
  role: Role;

  @Column({ type: 'varchar', length: 20, default: 'active' })
  status: 'active' | 'deactivated';

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
