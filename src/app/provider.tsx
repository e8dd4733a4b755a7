import { QueryClientProvider } from '@tanstack/react-query';
import { useState, type ReactNode } from 'react';
import { getMeQueryOptions } from '../lib/api/get-me.ts';
import { createQueryClient } from '../lib/query-client.ts';

export function AppProvider({ children }: { children: ReactNode }) {
  const [queryClient] = useState(() => {
    const client = createQueryClient({
      // Any 401 means the session is gone; the sign-in guard then sends the user to sign in.
      onUnauthorized: () => client.setQueryData(getMeQueryOptions().queryKey, null),
    });
    return client;
  });
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
