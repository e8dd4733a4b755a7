import { useEffect, useRef } from 'react';
import { useSearchParams } from 'react-router-dom';

/**
 * For a page opened from an e-mailed link (`?token=…`) that acts at once: sends the token to
 * `mutate` exactly once (React's development double effects included) and returns it ('' when
 * the link carried none).
 */
export function useLinkToken(mutate: (body: { token: string }) => void): string {
  const [search] = useSearchParams();
  const token = search.get('token') ?? '';
  const sent = useRef(false);
  useEffect(() => {
    if (sent.current || !token) return;
    sent.current = true;
    mutate({ token });
  }, [token, mutate]);
  return token;
}
