/**
 * The auth contracts (shared/api/auth.schema.ts), fetched on first use rather than with the first screen:
 * they bring zod (~26 kB gzipped), which the sign-in page does not need before the person submits. The
 * sign-in page starts this fetch as soon as the person starts on the form (src/app/router.tsx).
 */
export const loadAuthSchemas = () => import('../../../../shared/api/auth.schema');
