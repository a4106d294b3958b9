import { Check, Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { Language } from '../../shared/api/auth.schema';
import type { Role } from '../../shared/roles';

@Entity({ name: 'users' })
@Check('users_role_check', "role IN ('admin', 'officer', 'epidemiologist', 'supervisor', 'worker')")
@Check('users_language_check', "language IN ('en', 'fr', 'es', 'pt')")
@Check('users_temperature_unit_check', "temperature_unit IN ('C', 'F')")
@Check('users_rain_unit_check', "rain_unit IN ('mm', 'in')")
export class UserEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  /** Stored lower-cased; unique. */
  @Index('users_email_key', { unique: true })
  @Column({ type: 'text' })
  email: string;

  @Column({ name: 'display_name', type: 'text' })
  displayName: string;

  @Column({ type: 'text' })
  role: Role;

  /** Null until the invited user sets a password. */
  @Column({ name: 'password_hash', type: 'text', nullable: true })
  passwordHash: string | null;

  @Column({ type: 'boolean', default: true })
  active: boolean;

  /** The language of the interface after sign-in and of every mail to this user. */
  @Column({ type: 'text', default: 'en' })
  language: Language;

  /** Display units only: stored values stay °C and mm. */
  @Column({ name: 'temperature_unit', type: 'text', default: 'C' })
  temperatureUnit: 'C' | 'F';

  @Column({ name: 'rain_unit', type: 'text', default: 'mm' })
  rainUnit: 'mm' | 'in';

  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' })
  createdAt: Date;

  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' })
  updatedAt: Date;
}
