import type { QueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { useToast } from '../../components/toaster';
import { paths } from '../../config/paths';
import { NewPlanForm } from '../../features/review-plans/components/new-plan-form';
import { studentsQueryOptions } from '../../features/students/api/get-students';
import { meQueryOptions, useSignedIn } from '../../lib/auth';
import { StudentsGate } from './review-plans';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
  if (me && seesChildren(me)) void queryClient.prefetchQuery(studentsQueryOptions());
  return null;
};

export default function NewReviewPlanRoute() {
  const me = useSignedIn();
  const navigate = useNavigate();
  const toast = useToast();
  if (!seesChildren(me)) {
    return (
      <>
        <h1 className="wb-page-title">Build a review plan</h1>
        <NoHouseholdCallout me={me} />
      </>
    );
  }
  return (
    <StudentsGate title="Build a review plan">
      {({ list, studentId, choose }) => (
        <NewPlanForm
          students={list}
          studentId={studentId}
          onStudent={choose}
          onCreated={(plan) => {
            toast(`The plan for ${plan.student.name} is ready.`);
            void navigate(paths.app.reviewPlan.getHref(plan.id));
          }}
        />
      )}
    </StudentsGate>
  );
}
