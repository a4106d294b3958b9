import type { Role } from '../../shared/roles';
import { DISTRICT_SCOPED_ROLES } from '../../shared/roles';
import { forbidden } from '../http/errors';

/** The signed-in user as every service sees it. */
export interface Principal {
  userId: string;
  sessionId: string;
  email: string;
  displayName: string;
  role: Role;
  /** Own districts plus every district of `regionIds`. */
  districtIds: string[];
  /** The regions the user is scoped to (issue 17); absent for system principals. */
  regionIds?: string[];
}

export const isDistrictScoped = (p: Principal) => DISTRICT_SCOPED_ROLES.includes(p.role);

/** Community workers see their own districts only; everybody else sees all (docs/product.md § Roles). */
export const seesAllDistricts = (p: Principal) => p.role !== 'worker';

export function assertDistrictVisible(p: Principal, districtId: string): void {
  if (!seesAllDistricts(p) && !p.districtIds.includes(districtId)) throw forbidden('This district is not yours.');
}

/** Epidemiologists change counts of their assigned districts only. */
export function assertAssigned(p: Principal, districtId: string): void {
  if (isDistrictScoped(p) && !p.districtIds.includes(districtId)) throw forbidden('You are not assigned to this district.');
}
