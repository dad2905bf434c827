import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '../../shared/api/roles.js';

/**
 * An invitation or a password-reset link. Only the SHA-256 of the one-time token is stored;
 * the token itself exists only in the e-mail.
 */
@Entity('invitations')
export class Invitation {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'varchar', length: 20, default: 'invite' })
  kind: 'invite' | 'reset';

  @Column({ type: 'int', nullable: true })
  studioId: number | null;

  @Column({ type: 'varchar', length: 254 })
  email: string;

  @Column({ type: 'varchar', length: 20, nullable: true })
  role: Role | null;

  @Index({ unique: true })
  @Column({ type: 'char', length: 64 })
  tokenHash: string;

  @Column({ type: 'datetime', precision: 3 })
  expiresAt: Date;

  @Column({ type: 'datetime', precision: 3, nullable: true })
  usedAt: Date | null;

  @Column({ type: 'int', nullable: true })
  invitedById: number | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
