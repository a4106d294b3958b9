import type { ProfileDto, ProfileParameterDto } from '../../shared/api/profiles.schema';
import { findProfile } from '../../shared/model';
import type { Profile } from '../../shared/model/profile.schema';

type Node = Record<string, unknown>;

/** A curve or model choice shown as one line: its form and coefficients. */
function describe(node: Node): string | number | number[] | null {
  if (typeof node.value === 'number' || typeof node.value === 'string') return node.value;
  if (typeof node.monthDay === 'string') return node.monthDay;
  if (Array.isArray(node.coefficients)) return node.coefficients as number[];
  if (typeof node.form === 'string') return `${node.form} c=${node.c} t0=${node.t0} tm=${node.tm}`;
  if (typeof node.model === 'string') return node.model;
  return null;
}

/**
 * Every parameter of a profile, flattened to a list: each node of the profile that carries a provenance
 * tag is one parameter, named by its dotted path (the path a local variant's change names).
 */
export function profileParameters(profile: Profile): ProfileParameterDto[] {
  const out: ProfileParameterDto[] = [];
  const walk = (node: unknown, path: string[]) => {
    if (!node || typeof node !== 'object' || Array.isArray(node)) return;
    const n = node as Node;
    if (typeof n.tag === 'string') {
      out.push({
        path: path.join('.'),
        value: describe(n),
        low: typeof n.low === 'number' ? n.low : null,
        high: typeof n.high === 'number' ? n.high : null,
        unit: typeof n.unit === 'string' ? n.unit : null,
        tag: n.tag as ProfileParameterDto['tag'],
        source: (n.source as ProfileParameterDto['source']) ?? null,
        note: typeof n.note === 'string' ? n.note : null,
      });
    }
    for (const [k, v] of Object.entries(n)) if (k !== 'source') walk(v, [...path, k]);
  };
  for (const [k, v] of Object.entries(profile)) walk(v, [k]);
  return out;
}

export function presentProfile(
  profile: Profile,
  meta: { kind: 'published' | 'variant'; baseProfileId?: string | null; createdBy?: string | null; createdAt?: Date | null },
): ProfileDto {
  return {
    id: profile.id,
    name: profile.name,
    vector: profile.vector,
    pathogen: profile.pathogen,
    summary: profile.summary,
    kind: meta.kind,
    baseProfileId: meta.baseProfileId ?? null,
    defaultBiofix: profile.biofix.monthDay,
    parameters: profileParameters(profile),
    createdBy: meta.createdBy ?? null,
    createdAt: meta.createdAt ? meta.createdAt.toISOString() : null,
  };
}

/** One row of a district's profile assignment as the District file shows it. */
export function presentAssignment(r: { profileId: string; biofix: string | null; assignedAt: Date | null; assignedByName: string | null }) {
  const p = findProfile(r.profileId);
  return {
    profileId: r.profileId,
    profileName: p?.name ?? r.profileId,
    biofix: r.biofix,
    defaultBiofix: p?.biofix.monthDay ?? null,
    assignedBy: r.assignedByName,
    assignedAt: r.assignedAt ? new Date(r.assignedAt).toISOString() : null,
  };
}
