import { QueryClientProvider } from '@tanstack/react-query';
import { StrictMode, type ReactNode } from 'react';
import { queryClient } from '../lib/query-client';

/** Everything the pages share: strict mode and the one query cache (which also holds the session, key ['me']). */
export function AppProvider({ children }: { children: ReactNode }) {
  return (
    <StrictMode>
      <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>
    </StrictMode>
  );
}
