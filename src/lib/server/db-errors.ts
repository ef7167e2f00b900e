// PostgreSQL errors the office endpoints turn into answers a person can act on. Drizzle wraps
// the driver's error, so the SQLSTATE may sit on the error or on its cause.
type PgError = { code?: string; constraint?: string };

function pgError(error: unknown): PgError | undefined {
  if (typeof error !== 'object' || error === null) return undefined;
  const own = error as PgError & { cause?: unknown };
  if (typeof own.code === 'string') return own;
  return own.cause ? pgError(own.cause) : undefined;
}

/** Whether `error` is a unique violation (SQLSTATE 23505), optionally of one constraint. */
export function isUniqueViolation(error: unknown, constraint?: string): boolean {
  const pg = pgError(error);
  return pg?.code === '23505' && (constraint === undefined || pg.constraint === constraint);
}
