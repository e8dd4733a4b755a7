import { useNavigate, useSearchParams } from 'react-router-dom';
import { redirectTargetFrom } from '../../../config/paths.ts';
import { useMe } from '../../../lib/api/get-me.ts';

/**
 * For the sign-in and sign-up pages: where to go afterwards (the page the guard came from,
 * never off the site), whether the visitor is signed in already, and the step to get there.
 */
export function useAuthRedirect() {
  const me = useMe();
  const navigate = useNavigate();
  const [search] = useSearchParams();
  const target = redirectTargetFrom(search);
  return { target, signedIn: Boolean(me.data), proceed: () => navigate(target, { replace: true }) };
}
