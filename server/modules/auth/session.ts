import { DrizzleMySQLAdapter } from '@lucia-auth/adapter-drizzle';
import { Lucia, TimeSpan } from 'lucia';
import type { Db } from '../../db/client.ts';
import { sessions } from './sessions.table.ts';
import { users } from '../users/users.table.ts';

/**
 * Sessions through lucia 3 and its Drizzle adapter. lucia is deprecated upstream; keeping it
 * behind this one module means swapping it for hand-rolled sessions touches nothing else.
 */
export const SESSION_COOKIE = 'tidefield_session';

/**
 * `publicUrl` is where users reach the app: when it is https the cookie is always Secure (a
 * TLS-terminating proxy may talk plain http to us); otherwise it is Secure on https requests only.
 */
export function createSessionStore(db: Db, sessionDays: number, publicUrl?: string) {
  const alwaysSecure = publicUrl?.startsWith('https:') ?? false;
  const adapter = new DrizzleMySQLAdapter(db, sessions, users);
  const lucia = new Lucia(adapter, {
    sessionExpiresIn: new TimeSpan(Math.round(sessionDays * 24 * 3600), 's'),
    sessionCookie: {
      name: SESSION_COOKIE,
      expires: true,
      // Secure is decided in cookieFor: on for an https PUBLIC_URL or request, off on plain localhost.
      attributes: { sameSite: 'lax', secure: false },
    },
    getSessionAttributes: (attributes) => ({ activeDepartmentId: attributes.activeDepartmentId }),
    getUserAttributes: (attributes) => ({ email: attributes.email, name: attributes.name }),
  });

  return {
    async create(userId: string, activeDepartmentId: string | null) {
      return lucia.createSession(userId, { activeDepartmentId });
    },
    /** Validates a session id; a session in the second half of its life is extended (`fresh`). */
    validate(sessionId: string) {
      return lucia.validateSession(sessionId);
    },
    invalidate(sessionId: string) {
      return lucia.invalidateSession(sessionId);
    },
    invalidateUser(userId: string) {
      return lucia.invalidateUserSessions(userId);
    },
    /** The Set-Cookie value for a session (or a blank, expired cookie for null). */
    cookieFor(session: { id: string } | null, secure: boolean): string {
      const cookie = session ? lucia.createSessionCookie(session.id) : lucia.createBlankSessionCookie();
      cookie.attributes.secure = secure || alwaysSecure;
      cookie.attributes.httpOnly = true;
      cookie.attributes.path = '/';
      return cookie.serialize();
    },
    readCookie(cookieHeader: string | undefined): string | null {
      return lucia.readSessionCookie(cookieHeader ?? '');
    },
  };
}

export type SessionStore = ReturnType<typeof createSessionStore>;

declare module 'lucia' {
  interface Register {
    Lucia: Lucia<{ activeDepartmentId: string | null }, { email: string; name: string }>;
    DatabaseSessionAttributes: { activeDepartmentId: string | null };
    DatabaseUserAttributes: { email: string; name: string };
  }
}
