import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** A named group of districts, one level above the district (docs/product.md § Vocabulary), for scoping people and rolling up. */
@Entity({ name: 'regions' })
export class RegionEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('regions_code_key', { unique: true })
  @Column({ type: 'text' })
  code: string;

  @Column({ type: 'text' })
  name: string;

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
