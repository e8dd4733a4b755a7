import { pino, type Logger } from 'pino';
import type { Config } from './config.ts';

export function createLogger(config: Pick<Config, 'LOG_LEVEL'>): Logger {
  return pino({ level: config.LOG_LEVEL, redact: ['req.headers.cookie', 'req.headers.authorization', 'res.headers["set-cookie"]'] });
}
