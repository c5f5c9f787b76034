import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { missesQueryOptions } from '../../features/misses/api/get-misses';
import { filtersFromParams } from '../../features/misses/hooks/use-notebook-filters';
import { studentsQueryOptions } from '../../features/students/api/get-students';
import { meQueryOptions, type Me } from '../../lib/auth';
import { keptMe } from '../../lib/kept-me';

const seesChildren = (me: Me | null) => !!me && !me.user.isAdmin && me.household !== null;

/**
 * The notebook's data, asked for as the app starts rather than after its page's code has come:
 * a static loader runs while the lazy route loads (on a slow phone, a second sooner). The person
 * kept on this phone from the last time says whether to ask at once; otherwise who-am-I first.
 */
export const notebookLoader =
  (queryClient: QueryClient) =>
  async ({ request }: LoaderFunctionArgs) => {
    const me = seesChildren(keptMe())
      ? keptMe()
      : await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
    if (seesChildren(me) && !me?.offline && navigator.onLine !== false) {
      const filters = filtersFromParams(new URL(request.url).searchParams);
      void queryClient.prefetchQuery(studentsQueryOptions());
      void queryClient.prefetchQuery(missesQueryOptions(filters));
    }
    return null;
  };
