import { render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';

import { AppProvider } from '../app/provider';
import { createAppRoutes } from '../app/router';
import { createQueryClient } from '../lib/query-client';

/** Renders the real app (routes, loaders, providers) at `path`, on a fresh query cache. */
export function renderApp(path: string) {
  const queryClient = createQueryClient({ queries: { retry: false }, mutations: { retry: false } });
  const router = createMemoryRouter(createAppRoutes(queryClient), { initialEntries: [path] });
  const view = render(
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>,
  );
  return { ...view, router, queryClient };
}
