import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meResponseSchema } from '../../../../shared/contracts/auth.ts';
import { api } from '../../../lib/api-client.ts';
import { isMeQuery, useSetMe } from '../../../lib/api/get-me.ts';

/** Makes another of the user's departments the active one; answers the new MeResponse. */
export function switchDepartment(departmentId: string) {
  return api.post('/api/me/department', { body: { departmentId }, schema: meResponseSchema });
}

export function useSwitchDepartment() {
  const queryClient = useQueryClient();
  const setMe = useSetMe();
  return useMutation({
    mutationFn: switchDepartment,
    onSuccess: (me) => {
      setMe(me);
      // Everything else belonged to the previous department: load it afresh.
      return queryClient.resetQueries({ predicate: (query) => !isMeQuery(query) });
    },
  });
}
