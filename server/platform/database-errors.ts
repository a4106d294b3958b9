/** PostgreSQL's error codes that services turn into answers (PostgreSQL manual, Appendix A, "Error Codes"). */

/** 23505 unique_violation: another row already holds this key. */
export const isUniqueViolation = (err: unknown): boolean => (err as { code?: string } | null)?.code === '23505';
