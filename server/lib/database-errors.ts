import { ConnectionError, TimeoutError } from 'sequelize';

const UNREACHABLE_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'ER_SOCKET_UNEXPECTED_CLOSE',
  'ER_GET_CONNECTION_TIMEOUT',
  'ER_CONNECTION_TIMEOUT',
  // A hung server: the driver gave up on a silent socket (socketTimeout).
  'ER_SOCKET_TIMEOUT',
  'ER_CONNECTION_ALREADY_CLOSED',
  'ER_CMD_CONNECTION_CLOSED',
  'ER_SERVER_SHUTDOWN',
  'PROTOCOL_CONNECTION_LOST',
]);

/** True when an error means "the database cannot be reached now" (answered with 503). */
export function isDatabaseUnavailable(error: unknown): boolean {
  let current: unknown = error;
  for (let depth = 0; current && depth < 5; depth += 1) {
    if (current instanceof ConnectionError || current instanceof TimeoutError) return true;
    const code = (current as { code?: unknown }).code;
    if (typeof code === 'string' && UNREACHABLE_CODES.has(code)) return true;
    const errno = (current as { errno?: unknown }).errno;
    // 1927: connection killed, 4031: client disconnected for inactivity, 45001/45009/45012/45026/45028: closed connection, unexpected close, connect, socket and pool timeouts.
    if (typeof errno === 'number' && [1927, 4031, 45001, 45009, 45012, 45026, 45028].includes(errno)) return true;
    current = (current as { parent?: unknown; original?: unknown; cause?: unknown }).parent ??
      (current as { original?: unknown }).original ??
      (current as { cause?: unknown }).cause;
  }
  return false;
}
