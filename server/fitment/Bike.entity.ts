import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A make and model; its variants and year ranges are fitments. */
@Entity({ name: 'bikes' })
export class Bike {
  @PrimaryGeneratedColumn('uuid')
  id!: string;

  @Column({ type: 'varchar', length: 60 })
  make!: string;

  @Column({ type: 'varchar', length: 60 })
  model!: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt!: Date;
}
