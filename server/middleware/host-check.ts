import type { RequestHandler } from 'express';
import { publicBaseUrl, type Config } from '../config.ts';
import { AppError } from '../lib/errors.ts';

const LOCAL_NAMES = ['127.0.0.1', 'localhost', '::1'];

const bare = (hostname: string) => hostname.trim().toLowerCase().replace(/^\[(.*)\]$/, '$1');

/**
 * The host names this server answers to: ALLOWED_HOSTS (comma-separated, `*` for any), else
 * the host of PUBLIC_URL (or of this server's own address) plus 127.0.0.1 and localhost.
 */
export function allowedHosts(config: Pick<Config, 'ALLOWED_HOSTS' | 'PUBLIC_URL' | 'HOST' | 'PORT'>): Set<string> | 'any' {
  if (config.ALLOWED_HOSTS) {
    const names = config.ALLOWED_HOSTS.split(',').map((h) => h.trim()).filter(Boolean);
    if (names.includes('*')) return 'any';
    return new Set(names.map((h) => bare(h.replace(/:\d+$/, ''))));
  }
  return new Set([bare(new URL(publicBaseUrl(config)).hostname), ...LOCAL_NAMES]);
}

/**
 * Refuses requests addressed to a host name this server does not serve. A page on another
 * site whose name was re-pointed at 127.0.0.1 (DNS rebinding) reaches a local instance with
 * its own name in Host; without this check it could read the API as a same-origin page.
 * Ports are not compared (a dev proxy may listen on another port).
 */
export function hostCheck(allowed: Set<string> | 'any'): RequestHandler {
  return (req, _res, next) => {
    if (allowed === 'any') return next();
    const hostname = bare(req.hostname ?? '');
    if (allowed.has(hostname)) return next();
    next(
      new AppError({
        code: 'host_not_allowed',
        status: 421,
        message: `This server does not answer to the host name "${hostname}". Allowed: ${[...allowed].join(', ')} (set ALLOWED_HOSTS to change them).`,
      }),
    );
  };
}
