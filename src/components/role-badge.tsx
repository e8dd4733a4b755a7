import { ROLE_LABELS, type Role } from '../../shared/contracts/roles.ts';
import { Badge, type BadgeTone } from './ui/badge.tsx';

const ROLE_TONES: Record<Role, BadgeTone> = { observer: 'info', modeller: 'success', admin: 'accent' };

export function RoleBadge({ role }: { role: Role }) {
  return <Badge tone={ROLE_TONES[role]}>{ROLE_LABELS[role]}</Badge>;
}
