import { pino, stdSerializers, type Logger } from 'pino';
import type { Config } from './config.ts';

/** Properties of database errors that carry the values bound into a query (session ids, token hashes, e-mails). */
const QUERY_VALUE_KEYS = ['params', 'sql', 'values'];

/**
 * The error serializer of every log line: pino's own, but without the values bound into a
 * failed query. Drizzle's DrizzleQueryError repeats them in its message ("params: …") and
 * mysql2 inlines them into `sql`, so a database outage during authentication would otherwise
 * log the caller's raw session id.
 */
export function serializeError(error: unknown): unknown {
  if (!(error instanceof Error)) return error;
  const serialized = scrub(stdSerializers.err(error) as unknown as Record<string, unknown>);
  if (error.cause !== undefined) serialized.cause = serializeError(error.cause);
  return serialized;
}

function scrub(value: Record<string, unknown>): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const [key, v] of Object.entries(value)) {
    if (QUERY_VALUE_KEYS.includes(key) || key === 'cause') continue;
    out[key] = (key === 'message' || key === 'stack') && typeof v === 'string' ? v.replace(/\nparams: [\s\S]*?(?=\n {4}at |$)/, '\nparams: [redacted]') : v;
  }
  return out;
}

export function createLogger(config: Pick<Config, 'LOG_LEVEL'>, destination?: pino.DestinationStream): Logger {
  const options: pino.LoggerOptions = {
    level: config.LOG_LEVEL,
    redact: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]'],
    serializers: { err: serializeError },
  };
  return destination ? pino(options, destination) : pino(options);
}
