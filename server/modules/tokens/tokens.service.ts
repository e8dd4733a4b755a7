import { randomBytes } from 'node:crypto';
import { and, desc, eq, isNull } from 'drizzle-orm';
import type { CreateTokenBody, TokenSummary } from '../../../shared/contracts/tokens.ts';
import type { Db } from '../../db/client.ts';
import type { DbOrTx } from '../departments/departments.repository.ts';
import { newId } from '../../db/columns.ts';
import { notFound } from '../../lib/errors.ts';
import { sha256Hex as hashSecret } from '../../lib/secret-hash.ts';
import { recordAudit } from '../audit/audit.service.ts';
import { departmentOf, type RequestAuth } from '../../lib/request-auth.ts';
import type { CallerResolver } from '../auth/auth.middleware.ts';
import { users } from '../users/users.table.ts';
import { apiTokens } from './tokens.table.ts';

const TOKEN_PREFIX = 'tfk_';
/** lastUsedAt is written at most once a minute per token, not on every call. */
const LAST_USED_RESOLUTION_MS = 60_000;

function toSummary(row: typeof apiTokens.$inferSelect): TokenSummary {
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    scope: row.scope,
    departmentId: row.departmentId,
    createdAt: row.createdAt.toISOString(),
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    expiresAt: row.expiresAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
  };
}

/** Revokes every open token of a user (a password reset ends all their sessions and tokens). */
export async function revokeTokensOfUser(db: DbOrTx, userId: string, at: Date): Promise<void> {
  await db.update(apiTokens).set({ revokedAt: at }).where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)));
}

export function createTokensService(db: Db) {
  return {
    /** Creates a token acting for the caller in the active department; the secret is returned once. */
    async create(auth: RequestAuth, body: CreateTokenBody) {
      const department = departmentOf(auth);
      const secret = TOKEN_PREFIX + randomBytes(24).toString('base64url');
      const now = new Date();
      const row = {
        id: newId(),
        userId: auth.user.id,
        departmentId: department.id,
        name: body.name,
        scope: body.scope,
        secretHash: hashSecret(secret),
        prefix: secret.slice(0, 10),
        createdAt: now,
        lastUsedAt: null,
        expiresAt: body.expiresInDays ? new Date(now.getTime() + body.expiresInDays * 86_400_000) : null,
        revokedAt: null,
      };
      await db.insert(apiTokens).values(row);
      await recordAudit(db, { departmentId: department.id, actorUserId: auth.user.id, action: 'token.created', target: row.id });
      return { ...toSummary(row), token: secret };
    },

    /** The caller's own tokens for the active department. */
    async list(auth: RequestAuth): Promise<TokenSummary[]> {
      const rows = await db
        .select()
        .from(apiTokens)
        .where(and(eq(apiTokens.userId, auth.user.id), eq(apiTokens.departmentId, departmentOf(auth).id)))
        .orderBy(desc(apiTokens.createdAt));
      return rows.map(toSummary);
    },

    async revoke(auth: RequestAuth, tokenId: string): Promise<void> {
      const department = departmentOf(auth);
      const result = await db
        .update(apiTokens)
        .set({ revokedAt: new Date() })
        .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, auth.user.id), eq(apiTokens.departmentId, department.id), isNull(apiTokens.revokedAt)));
      if (result[0].affectedRows === 0) {
        const existing = await db.select({ id: apiTokens.id }).from(apiTokens)
          .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, auth.user.id), eq(apiTokens.departmentId, department.id)));
        if (existing.length === 0) throw notFound('That API token');
        return; // already revoked: revoking again changes nothing
      }
      await recordAudit(db, { departmentId: department.id, actorUserId: auth.user.id, action: 'token.revoked', target: tokenId });
    },

    /** Resolves `Authorization: Bearer tfk_…` to its user and department, or null. */
    resolver(): CallerResolver {
      return async (authorization) => {
        const match = /^Bearer\s+(\S+)$/i.exec(authorization);
        if (!match || !match[1].startsWith(TOKEN_PREFIX)) return null;
        const rows = await db
          .select({ token: apiTokens, user: { id: users.id, email: users.email, name: users.name } })
          .from(apiTokens)
          .innerJoin(users, eq(users.id, apiTokens.userId))
          .where(eq(apiTokens.secretHash, hashSecret(match[1])))
          .limit(1);
        const found = rows[0];
        const now = Date.now();
        if (!found || found.token.revokedAt || (found.token.expiresAt && found.token.expiresAt.getTime() <= now)) return null;
        if (!found.token.lastUsedAt || now - found.token.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
          await db.update(apiTokens).set({ lastUsedAt: new Date(now) }).where(eq(apiTokens.id, found.token.id));
        }
        return { user: found.user, tokenId: found.token.id, tokenScope: found.token.scope, departmentId: found.token.departmentId };
      };
    },
  };
}

export type TokensService = ReturnType<typeof createTokensService>;
