import type { RequestHandler } from 'express';
import type { TokenScope } from '../../../shared/contracts/tokens.ts';
import type { Db } from '../../db/client.ts';
import { unauthenticated } from '../../lib/errors.ts';
import type { RequestAuth } from '../../lib/request-auth.ts';
import { setActiveDepartment } from './auth.repository.ts';
import { loadCaller } from './caller.ts';
import type { SessionStore } from './session.ts';

/** Resolves a caller from something other than the session cookie (e.g. a Bearer token). */
export type CallerResolver = (authorization: string) => Promise<{ user: RequestAuth['user']; tokenId: string; tokenScope: TokenScope; departmentId: string } | null>;

/**
 * Resolves the caller once per request into res.locals.auth: a session cookie (renewed when
 * lucia says it is fresh) or, when given, a personal API token. Memberships are read on every
 * request, so a removed member loses access at once.
 */
export function authenticate(db: Db, sessions: SessionStore, resolveToken?: CallerResolver): RequestHandler {
  return async (req, res, next) => {
    const authorization = req.headers.authorization;
    if (authorization && resolveToken) {
      const caller = await resolveToken(authorization);
      if (!caller) return next(unauthenticated('That API token is unknown, expired or revoked.'));
      res.locals.auth = await loadCaller(db, { user: caller.user, tokenId: caller.tokenId, tokenScope: caller.tokenScope }, caller.departmentId);
      return next();
    }
    const sessionId = sessions.readCookie(req.headers.cookie);
    if (!sessionId) return next();
    const { session, user } = await sessions.validate(sessionId);
    const secure = req.secure;
    if (!session || !user) {
      res.append('Set-Cookie', sessions.cookieFor(null, secure));
      return next();
    }
    if (session.fresh) res.append('Set-Cookie', sessions.cookieFor(session, secure));
    const auth = await loadCaller(db, { user: { id: user.id, email: user.email, name: user.name }, sessionId: session.id }, session.activeDepartmentId);
    if (auth.department?.id !== session.activeDepartmentId) await setActiveDepartment(db, session.id, auth.department?.id ?? null);
    res.locals.auth = auth;
    next();
  };
}
