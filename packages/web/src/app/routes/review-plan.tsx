import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { reviewPlanQueryOptions } from '../../features/review-plans/api/get-review-plan';
import { PlanView } from '../../features/review-plans/components/plan-view';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
    const id = Number(params.planId);
    if (me && seesChildren(me) && Number.isInteger(id) && id > 0) {
      void queryClient.prefetchQuery(reviewPlanQueryOptions(id));
    }
    return null;
  };

export default function ReviewPlanRoute() {
  const me = useSignedIn();
  const { planId } = useParams();
  if (!seesChildren(me)) {
    return (
      <>
        <h1 className="wb-page-title">Review plan</h1>
        <NoHouseholdCallout me={me} />
      </>
    );
  }
  const id = Number(planId);
  if (!Number.isInteger(id) || id <= 0) throw new Response('Not here', { status: 404 });
  // Owners and parents e-mail plans; a tutor prints or downloads them.
  return <PlanView key={id} planId={id} canSend={canEditHousehold(me)} />;
}
