/** PostgreSQL error helpers (SQLSTATE codes from the PostgreSQL manual, Appendix A). */
interface PgError {
  code?: string;
  constraint?: string;
}

export function isUniqueViolation(error: unknown, constraint?: string): boolean {
  const e = error as PgError;
  return e?.code === '23505' && (constraint === undefined || e.constraint === constraint);
}

/** Connection-level failures: the database is down or restarting (class 08, 57P01–57P03) or unreachable. */
export function isDatabaseUnavailable(error: unknown): boolean {
  const e = error as PgError & { message?: string };
  if (typeof e?.code === 'string' && (e.code.startsWith('08') || ['57P01', '57P02', '57P03', 'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT'].includes(e.code))) return true;
  // pg's own wording for a client whose connection broke earlier (see db/database.ts).
  return /Connection terminated|timeout exceeded when trying to connect|is not queryable/i.test(e?.message ?? '');
}
