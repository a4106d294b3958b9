import { parseProfile, type Profile } from './profile.schema';
import aedesAegyptiDengue from './profiles/aedes-aegypti-dengue.json';
import aedesAlbopictusDengue from './profiles/aedes-albopictus-dengue.json';
import anophelesFalciparum from './profiles/anopheles-falciparum.json';
import anophelesVivax from './profiles/anopheles-vivax.json';
import culexWnv from './profiles/culex-wnv.json';

/**
 * The shipped profiles: JSON data validated by the profile schema when this module loads (a bad file
 * fails loudly here, not in a season run). The server will later hold amended copies in PostgreSQL;
 * those pass through `parseProfile` the same way.
 */
const RAW: readonly unknown[] = [aedesAegyptiDengue, aedesAlbopictusDengue, culexWnv, anophelesFalciparum, anophelesVivax];

export const profiles: readonly Profile[] = Object.freeze(RAW.map((p) => parseProfile(p)));

export const PROFILE_IDS = profiles.map((p) => p.id) as readonly string[];

/** The shipped profiles (validated). */
export function loadProfiles(): readonly Profile[] {
  return profiles;
}

/** A shipped profile by id, or undefined. */
export function findProfile(id: string): Profile | undefined {
  return profiles.find((p) => p.id === id);
}

/** A shipped profile by id; throws RangeError for an unknown id. */
export function getProfile(id: string): Profile {
  const p = findProfile(id);
  if (!p) throw new RangeError(`unknown profile: ${id} (known: ${PROFILE_IDS.join(', ')})`);
  return p;
}
