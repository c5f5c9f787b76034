import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { NoHouseholdCallout, seesChildren } from '../../components/no-household';
import { paths } from '../../config/paths';
import { answerKeyQueryOptions } from '../../features/answer-keys/api/get-answer-key';
import { KeyEditor } from '../../features/answer-keys/components/key-editor';
import { coursesQueryOptions, useCourses } from '../../features/curriculum/api/get-courses';
import { useStudents } from '../../features/students/api/get-students';
import { canEditHousehold, meQueryOptions, useSignedIn } from '../../lib/auth';
import { readId } from './route-params';

export const clientLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const id = readId(params.keyId);
    if (id === null) throw new Response('Not here', { status: 404 });
    const me = await queryClient.ensureQueryData(meQueryOptions()).catch(() => null);
    if (me && seesChildren(me)) {
      void queryClient.prefetchQuery(answerKeyQueryOptions(id));
      void queryClient.prefetchQuery(coursesQueryOptions());
    }
    return null;
  };

function Editor({ id, canEdit }: { id: number; canEdit: boolean }) {
  const courses = useCourses();
  const students = useStudents();
  const studentName = (studentId: number) =>
    students.data?.items.find((s) => s.id === studentId)?.name ?? 'A student';
  return (
    <>
      <p className="wb-backlink">
        <Link to={paths.app.answerKeys.getHref()}>← All answer keys</Link>
      </p>
      <KeyEditor
        keyId={id}
        canEdit={canEdit}
        courses={courses.data?.items ?? []}
        studentName={studentName}
      />
    </>
  );
}

export default function AnswerKeyRoute() {
  const me = useSignedIn();
  const id = readId(useParams().keyId);
  if (!seesChildren(me)) return <NoHouseholdCallout me={me} />;
  if (id === null) return null;
  return <Editor key={id} id={id} canEdit={canEditHousehold(me)} />;
}
