import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** Every message the product sends, with its delivery outcome. */
@Entity('mail_log')
export class MailLog {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'int', nullable: true })
  studioId: number | null;

  @Column({ type: 'varchar', length: 254 })
  toAddress: string;

  @Column({ type: 'varchar', length: 60 })
  template: string;

  @Column({ type: 'varchar', length: 300 })
  subject: string;

  @Column({ type: 'varchar', length: 20 })
  status: 'sent' | 'failed';

  @Column({ type: 'varchar', length: 500, nullable: true })
  error: string | null;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
