import { Check, Column, Entity, JoinColumn, ManyToOne, PrimaryColumn } from 'typeorm';
import type { Language } from '../../shared/api/auth.schema';
import { BulletinEntity } from './bulletin.entity';

/**
 * A bulletin in another language than the default one kept in `bulletins`: written with it, in the same
 * transaction, for each language its recipients read (user preference). The outbox attaches the PDF of
 * the message's Content-Language, or the default one.
 */
@Entity({ name: 'bulletin_translations' })
@Check('bulletin_translations_language_check', "language IN ('en', 'fr', 'es', 'pt')")
export class BulletinTranslationEntity {
  @PrimaryColumn({ name: 'bulletin_id', type: 'uuid' })
  bulletinId: string;

  @PrimaryColumn({ type: 'text' })
  language: Language;

  @ManyToOne(() => BulletinEntity, { onDelete: 'CASCADE' })
  @JoinColumn({ name: 'bulletin_id' })
  bulletin?: BulletinEntity;

  @Column({ type: 'text' })
  subject: string;

  @Column({ type: 'text' })
  html: string;

  @Column({ type: 'text' })
  text: string;

  @Column({ type: 'bytea' })
  pdf: Buffer;
}
