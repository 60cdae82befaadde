import { Suspense, useState, type ReactNode } from 'react';
import { QueryClientProvider } from '@tanstack/react-query';

import { AppErrorBoundary } from '@/components/errors/app-error-boundary';
import { FullPageLoading } from '@/components/ui/loading-status';
import { createQueryClient } from '@/lib/query-client';

type AppProviderProps = { children: ReactNode };

export function AppProvider({ children }: AppProviderProps) {
  const [queryClient] = useState(createQueryClient);

  return (
    <AppErrorBoundary>
      <QueryClientProvider client={queryClient}>
        <Suspense fallback={<FullPageLoading />}>{children}</Suspense>
      </QueryClientProvider>
    </AppErrorBoundary>
  );
}
