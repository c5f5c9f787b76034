import { useState } from 'react';

import { createQueryClient } from '../lib/query-client';
import { AppProvider } from './provider';
import { AppRouter } from './router';

export function App() {
  const [queryClient] = useState(() => createQueryClient());
  return (
    <AppProvider queryClient={queryClient}>
      <AppRouter queryClient={queryClient} />
    </AppProvider>
  );
}
