import { ROLES, type Role } from '../../../shared/roles';

/** Who may call a route, as docs/product.md § Roles says; the route × role test checks the app against these tables. */
export type Who = Role | 'anonymous';
export type AccessTable = Record<string, Who[]>;
export const ALL_SIGNED_IN: Who[] = [...ROLES];
export const EVERYBODY: Who[] = ['anonymous', ...ROLES];
