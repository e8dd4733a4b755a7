import { hasActiveDepartment, type ActiveMe } from '../../../lib/active-me.ts';
import { useMe } from '../../../lib/api/get-me.ts';

/** The session behind the sign-in guard, which only lets users with a department through. */
export function useSignedInMe(): ActiveMe {
  const { data } = useMe();
  if (!data || !hasActiveDepartment(data)) throw new Error('useSignedInMe is for pages behind the sign-in guard only');
  return data;
}
