import type { TokenSummary } from '../../../../shared/contracts/tokens.ts';
import type { BadgeTone } from '../../../components/ui/badge.tsx';

export type TokenState = 'active' | 'expired' | 'revoked';

/** Whether a token still works at `now`: revoked wins over expired. */
export function tokenState(token: Pick<TokenSummary, 'revokedAt' | 'expiresAt'>, now: Date): TokenState {
  if (token.revokedAt) return 'revoked';
  if (token.expiresAt && new Date(token.expiresAt).getTime() <= now.getTime()) return 'expired';
  return 'active';
}

export const TOKEN_STATE_TEXT: Record<TokenState, { label: string; tone: BadgeTone }> = {
  active: { label: 'Active', tone: 'success' },
  expired: { label: 'Expired', tone: 'warning' },
  revoked: { label: 'Revoked', tone: 'danger' },
};

/** The shell command that lists the department's runs with a token (the secret, or a placeholder). */
export function curlExample(origin: string, token: string): string {
  return `curl -H "Authorization: Bearer ${token}" ${origin}/api/runs`;
}

/** What the secret looks like in the list: its first characters and an ellipsis. */
export function maskedPrefix(prefix: string): string {
  return `${prefix}…`;
}
