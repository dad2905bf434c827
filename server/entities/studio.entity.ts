import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A studio is a tenant: every row of studio data hangs off one. */
@Entity('studios')
export class Studio {
  @PrimaryGeneratedColumn({ type: 'int' })
  id: number;

  @Column({ type: 'varchar', length: 120 })
  name: string;

  /** Staff seats paid for (admin, cartographer, editor). Client reviewers take none. */
  @Column({ type: 'int', default: 3 })
  seatCount: number;

  @CreateDateColumn({ type: 'datetime', precision: 3, default: () => 'CURRENT_TIMESTAMP(3)' })
  createdAt: Date;
}
