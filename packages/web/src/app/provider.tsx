import { BlueprintProvider } from '@blueprintjs/core';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';

import { ToasterProvider } from '../components/toaster';

/** Everything the app needs above its routes: Blueprint's contexts, the query cache, toasts. */
export function AppProvider({
  queryClient,
  children,
}: {
  queryClient: QueryClient;
  children: ReactNode;
}) {
  return (
    <BlueprintProvider>
      <QueryClientProvider client={queryClient}>
        <ToasterProvider>{children}</ToasterProvider>
      </QueryClientProvider>
    </BlueprintProvider>
  );
}
