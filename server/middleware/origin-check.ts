import type { RequestHandler } from 'express';
import { AppError } from '../lib/errors.ts';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Cross-site request forgery guard for every state-changing request: a browser always sends
 * Origin on such requests, and it must name this host. Non-browser clients (curl, scripts with
 * a Bearer token) send no Origin and pass; a browser request from another site is refused.
 * `exempt` lists paths called by other servers (e.g. a signed payment webhook).
 */
export function originCheck(exempt: string[] = []): RequestHandler {
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method) || exempt.includes(req.path)) return next();
    const origin = req.headers.origin;
    const host = req.headers['x-forwarded-host'] && req.app.get('trust proxy') ? String(req.headers['x-forwarded-host']) : req.headers.host;
    if (req.headers['sec-fetch-site'] === 'cross-site') return next(badOrigin(origin ?? 'another site'));
    if (origin === undefined) return next();
    let originHost: string | null = null;
    try {
      originHost = new URL(origin).host;
    } catch {
      originHost = null;
    }
    if (!host || originHost !== host) return next(badOrigin(origin));
    next();
  };
}

const badOrigin = (origin: string) =>
  new AppError({
    code: 'bad_origin',
    status: 403,
    message: `This request came from ${origin}, not from this site, so it was refused.`,
  });
