import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** A notifiable disease as data (dengue, malaria by species, West Nile virus, …), linked to the model profiles that carry it. */
@Entity({ name: 'diseases' })
export class DiseaseEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Index('diseases_code_key', { unique: true })
  @Column({ type: 'text' })
  code: string;

  @Column({ type: 'text' })
  name: string;

  /** Ids of the season-model profiles (shared/model/profiles) whose vector carries this pathogen. */
  @Column({ name: 'profile_ids', type: 'text', array: true, default: () => "'{}'" })
  profileIds: string[];

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;
}
