/** MariaDB/InnoDB deadlock (1213) and lock-wait timeout (1205): the transaction was rolled back and can run again. */
function isRetryable(err: unknown): boolean {
  const e = err as { errno?: number; driverError?: { errno?: number } };
  const errno = e?.errno ?? e?.driverError?.errno;
  return errno === 1213 || errno === 1205;
}

/** Run a whole transaction again (a few times, with jitter) when InnoDB chose it as a deadlock victim. */
export async function retryOnDeadlock<T>(work: () => Promise<T>, attempts = 4): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await work();
    } catch (err) {
      if (i >= attempts || !isRetryable(err)) throw err;
      await new Promise((r) => setTimeout(r, 5 + Math.random() * 20 * i));
    }
  }
}

// ---- the database cannot be reached ------------------------------------------------------------

/**
 * Codes that mean "the database is not there right now", not "this query is wrong":
 * - Node's socket errors (nodejs.org/api/errors.html "Common system errors"): ECONNREFUSED (MariaDB stopped or
 *   restarting), ECONNRESET / EPIPE (killed mid-conversation), ETIMEDOUT, EHOSTUNREACH, ENETUNREACH, ENOTFOUND, EAI_AGAIN.
 * - mysql2's own (its lib/base/connection.js): PROTOCOL_CONNECTION_LOST ("Connection lost: The server closed the
 *   connection."), PROTOCOL_SEQUENCE_TIMEOUT, PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR, PROTOCOL_ENQUEUE_AFTER_QUIT.
 * - MariaDB server errors (mariadb.com/kb "MariaDB Error Codes"): 1040 ER_CON_COUNT_ERROR (too many connections),
 *   1053 ER_SERVER_SHUTDOWN (shutdown in progress), 1927 ER_CONNECTION_KILLED.
 */
const UNAVAILABLE_CODES = new Set([
  "ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT", "EHOSTUNREACH", "ENETUNREACH", "ENOTFOUND", "EAI_AGAIN",
  "PROTOCOL_CONNECTION_LOST", "PROTOCOL_SEQUENCE_TIMEOUT", "PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR", "PROTOCOL_ENQUEUE_AFTER_QUIT",
  "ER_CON_COUNT_ERROR", "ER_SERVER_SHUTDOWN", "ER_CONNECTION_KILLED",
]);
const UNAVAILABLE_ERRNOS = new Set([1040, 1053, 1927]);
/**
 * Messages with no code: mysql2's pool after end() ("Pool is closed.", lib/base/pool.js), a command on a connection
 * that already died ("Can't add new command when connection is in closed state", lib/base/connection.js), and
 * TypeORM's MysqlDriver with no pool ("Connection is not established with mysql database").
 */
const UNAVAILABLE_MESSAGES = [/^Pool is closed/, /connection is in closed state/, /Can't write in closed state/, /^Connection lost: The server closed the connection/, /Connection is not established with mysql database/];

interface MaybeDbError {
  code?: unknown;
  errno?: unknown;
  message?: unknown;
  fatal?: unknown;
  sqlState?: unknown;
  driverError?: unknown;
  cause?: unknown;
  errors?: unknown;
  name?: unknown;
}

/** Does this error come from the database layer (mysql2 or TypeORM), as opposed to, say, an SMTP or HTTP client? */
function fromDatabaseLayer(e: MaybeDbError, wrapped: boolean): boolean {
  // mysql2 marks socket and protocol failures `fatal` and server errors with a `sqlState`; TypeORM wraps them in
  // QueryFailedError (with `driverError`) or TypeORMError.
  return wrapped || e.fatal === true || typeof e.sqlState === "string" || e.name === "QueryFailedError" || e.name === "TypeORMError";
}

/**
 * True when a failure means the database is unreachable (stopped, restarting, killed, out of connections): the
 * request did not run and may be tried again. Looks through TypeORM's `driverError`, an Error's `cause` and an
 * AggregateError's `errors` (Node 20's connect tries every address of a host name).
 */
export function isDatabaseUnavailable(err: unknown, depth = 0, wrapped = false): boolean {
  if (!err || typeof err !== "object" || depth > 4) return false;
  const e = err as MaybeDbError;
  const message = typeof e.message === "string" ? e.message : "";
  if (UNAVAILABLE_MESSAGES.some((re) => re.test(message))) return true;
  if (fromDatabaseLayer(e, wrapped) && ((typeof e.code === "string" && UNAVAILABLE_CODES.has(e.code)) || (typeof e.errno === "number" && UNAVAILABLE_ERRNOS.has(e.errno)))) return true;
  const inner = e.driverError ?? e.cause;
  if (inner && isDatabaseUnavailable(inner, depth + 1, wrapped || e.driverError !== undefined)) return true;
  if (Array.isArray(e.errors)) return e.errors.some((x) => isDatabaseUnavailable(x, depth + 1, wrapped || fromDatabaseLayer(e, wrapped)));
  return false;
}
