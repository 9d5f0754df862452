/** PostgreSQL error codes (SQLSTATE, Appendix A of the PostgreSQL manual) that services turn into domain errors. */
const UNIQUE_VIOLATION = '23505';
const FOREIGN_KEY_VIOLATION = '23503';

function sqlState(error: unknown): string | undefined {
  return typeof error === 'object' && error !== null ? (error as { code?: unknown }).code?.toString() : undefined;
}

/** A unique index refused the row: a name already used, or a race that another transaction won. */
export function isUniqueViolation(error: unknown): boolean {
  return sqlState(error) === UNIQUE_VIOLATION;
}

/** A foreign key refused the change: the row is still referenced, or the referenced row is gone. */
export function isForeignKeyViolation(error: unknown): boolean {
  return sqlState(error) === FOREIGN_KEY_VIOLATION;
}
