import type { MeResponse } from '../../shared/contracts/auth.ts';
import type { Role } from '../../shared/contracts/roles.ts';

/** A session with an active department, which every page of the app needs. */
export type ActiveMe = MeResponse & { department: NonNullable<MeResponse['department']>; role: Role };

/** False only for a user whose every membership was removed: they can sign in but see nothing. */
export function hasActiveDepartment(me: MeResponse): me is ActiveMe {
  return me.department !== null && me.role !== null;
}
