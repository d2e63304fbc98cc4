/**
 * PostgreSQL error classes and codes that mean "the database is not there right now" rather than "this request is
 * wrong" (PostgreSQL 15 manual, appendix A "Error Codes": class 08 connection exception, 57P01 admin_shutdown,
 * 57P02 crash_shutdown, 57P03 cannot_connect_now, 53300 too_many_connections).
 */
const SQLSTATES = new Set(['57P01', '57P02', '57P03', '53300']);
// Only a refused connect: the other socket errors of a dropped database connection arrive as "Connection terminated".
const SOCKET_CODES = new Set(['ECONNREFUSED']);
// node-postgres and knex report a dropped or unobtainable connection only in words (knex puts the SQL in front).
const MESSAGES = [
  /Connection terminated/i,
  /Knex: Timeout acquiring a connection/i,
  /Client has encountered a connection error/i,
  /timeout exceeded when trying to connect/i,
  /the database system is (starting up|shutting down|in recovery mode)/i,
];

interface ErrorLike {
  code?: unknown;
  message?: unknown;
  errors?: unknown;
  cause?: unknown;
}

/** True when `err` (or an error it wraps) says the database connection was lost or refused. */
export function isDatabaseUnavailable(err: unknown, depth = 0): boolean {
  if (!err || typeof err !== 'object' || depth > 3) return false;
  const e = err as ErrorLike;
  const code = typeof e.code === 'string' ? e.code : '';
  if (SQLSTATES.has(code) || /^08[0-9A-Z]{3}$/.test(code) || SOCKET_CODES.has(code)) return true;
  if (typeof e.message === 'string' && MESSAGES.some((m) => m.test(e.message as string))) return true;
  // A refused connection to a host with several addresses arrives as an AggregateError.
  if (Array.isArray(e.errors) && e.errors.some((x) => isDatabaseUnavailable(x, depth + 1))) return true;
  return isDatabaseUnavailable(e.cause, depth + 1);
}
