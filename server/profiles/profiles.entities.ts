import { ProfileVariantEntity } from './profile-variant.entity';

export const profilesEntities: Function[] = [ProfileVariantEntity];
