import type { QueryClient } from '@tanstack/react-query';
import { useMemo } from 'react';
import {
  createBrowserRouter,
  RouterProvider,
  type LoaderFunctionArgs,
  type RouteObject,
} from 'react-router-dom';

import { PageSkeleton } from '../components/page-skeleton';
import { paths } from '../config/paths';
import { notebookLoader } from './routes/notebook-loader';
import { HomeRedirect, protectedLoader, ProtectedRoute } from './routes/protected';
import { RouteError } from './routes/route-error';

type RouteModule = {
  clientLoader?: (queryClient: QueryClient) => (args: LoaderFunctionArgs) => Promise<unknown>;
  default: React.ComponentType;
};

/** Route modules are loaded on first visit; their loaders only warm the query cache. */
const lazyRoute =
  (queryClient: QueryClient, load: () => Promise<RouteModule>): RouteObject['lazy'] =>
  async () => {
    const { clientLoader, default: Component } = await load();
    return clientLoader ? { loader: clientLoader(queryClient), Component } : { Component };
  };

export function createAppRoutes(queryClient: QueryClient): RouteObject[] {
  return [
    {
      errorElement: <RouteError />,
      hydrateFallbackElement: <PageSkeleton />,
      children: [
        {
          path: paths.signIn.path,
          lazy: lazyRoute(queryClient, () => import('./routes/sign-in')),
        },
        {
          path: paths.createAccount.path,
          lazy: lazyRoute(queryClient, () => import('./routes/create-account')),
        },
        {
          path: paths.forgotPassword.path,
          lazy: lazyRoute(queryClient, () => import('./routes/forgot-password')),
        },
        {
          path: paths.resetPassword.path,
          lazy: lazyRoute(queryClient, () => import('./routes/reset-password')),
        },
        {
          path: paths.invitation.path,
          lazy: lazyRoute(queryClient, () => import('./routes/invitation')),
        },
        {
          path: paths.verifyEmail.path,
          lazy: lazyRoute(queryClient, () => import('./routes/verify-email')),
        },
        {
          path: paths.app.root.path,
          loader: protectedLoader(queryClient),
          element: <ProtectedRoute />,
          children: [
            { index: true, element: <HomeRedirect /> },
            {
              path: paths.app.students.path,
              lazy: lazyRoute(queryClient, () => import('./routes/students')),
            },
            {
              path: paths.app.student.path,
              lazy: lazyRoute(queryClient, () => import('./routes/student')),
            },
            {
              path: paths.app.curriculum.path,
              lazy: lazyRoute(queryClient, () => import('./routes/curriculum')),
            },
            {
              path: paths.app.answerKeys.path,
              lazy: lazyRoute(queryClient, () => import('./routes/answer-keys')),
            },
            {
              path: paths.app.answerKey.path,
              lazy: lazyRoute(queryClient, () => import('./routes/answer-key')),
            },
            {
              path: paths.app.sittings.path,
              lazy: lazyRoute(queryClient, () => import('./routes/sittings')),
            },
            {
              path: paths.app.newSitting.path,
              lazy: lazyRoute(queryClient, () => import('./routes/new-sitting')),
            },
            {
              path: paths.app.sitting.path,
              lazy: lazyRoute(queryClient, () => import('./routes/sitting')),
            },
            {
              path: paths.app.sittingMisses.path,
              lazy: lazyRoute(queryClient, () => import('./routes/sitting-misses')),
            },
            {
              path: paths.app.logMiss.path,
              lazy: lazyRoute(queryClient, () => import('./routes/log-miss')),
            },
            {
              path: paths.app.notebook.path,
              loader: notebookLoader(queryClient),
              lazy: lazyRoute(queryClient, () => import('./routes/notebook')),
            },
            {
              path: paths.app.miss.path,
              lazy: lazyRoute(queryClient, () => import('./routes/miss')),
            },
            {
              path: paths.app.patterns.path,
              lazy: lazyRoute(queryClient, () => import('./routes/patterns')),
            },
            {
              path: paths.app.checkUp.path,
              lazy: lazyRoute(queryClient, () => import('./routes/check-up')),
            },
            {
              path: paths.app.reviewPlans.path,
              lazy: lazyRoute(queryClient, () => import('./routes/review-plans')),
            },
            {
              path: paths.app.newReviewPlan.path,
              lazy: lazyRoute(queryClient, () => import('./routes/new-review-plan')),
            },
            {
              path: paths.app.reviewPlan.path,
              lazy: lazyRoute(queryClient, () => import('./routes/review-plan')),
            },
            {
              path: paths.app.members.path,
              lazy: lazyRoute(queryClient, () => import('./routes/members')),
            },
            {
              path: paths.app.account.path,
              lazy: lazyRoute(queryClient, () => import('./routes/account')),
            },
          ],
        },
        {
          path: '*',
          loader: () => {
            throw new Response('Not here', { status: 404 });
          },
        },
      ],
    },
  ];
}

export function AppRouter({ queryClient }: { queryClient: QueryClient }) {
  const router = useMemo(() => createBrowserRouter(createAppRoutes(queryClient)), [queryClient]);
  return <RouterProvider router={router} />;
}
