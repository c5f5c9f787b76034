import { Button, Intent } from '@blueprintjs/core';
import { BookIcon, PlusIcon } from '@blueprintjs/icons';
import { useCallback, useState } from 'react';

import { ConfirmDeleteAlert } from '../../../components/confirm-delete-alert';
import { EmptyState, ErrorState, LoadingState } from '../../../components/states';
import { useToast } from '../../../components/toaster';
import { useDeleteCourse } from '../api/delete-course';
import { useDeleteLesson } from '../api/delete-lesson';
import { useCourses } from '../api/get-courses';
import type { Course, Lesson } from '../types';
import { CourseDialog } from './course-dialog';
import { CourseSection } from './course-section';
import { LessonDialog } from './lesson-dialog';

type Deleting = { kind: 'course'; course: Course } | { kind: 'lesson'; lesson: Lesson } | null;

/** The Curriculum page: the household's courses, each with its numbered lessons. */
export function CurriculumView({ canEdit }: { canEdit: boolean }) {
  const courses = useCourses();
  const toast = useToast();
  const deleteCourse = useDeleteCourse();
  const deleteLesson = useDeleteLesson();
  const [courseDialog, setCourseDialog] = useState<{ open: boolean; course: Course | null }>({
    open: false,
    course: null,
  });
  const [editingLesson, setEditingLesson] = useState<Lesson | null>(null);
  const [deleting, setDeleting] = useState<Deleting>(null);

  const onEditCourse = useCallback((course: Course) => setCourseDialog({ open: true, course }), []);
  const onDeleteCourse = useCallback(
    (course: Course) => setDeleting({ kind: 'course', course }),
    [],
  );
  const onEditLesson = useCallback((lesson: Lesson) => setEditingLesson(lesson), []);
  const onDeleteLesson = useCallback(
    (lesson: Lesson) => setDeleting({ kind: 'lesson', lesson }),
    [],
  );

  const addButton = canEdit ? (
    <Button
      intent={Intent.PRIMARY}
      icon={<PlusIcon />}
      onClick={() => setCourseDialog({ open: true, course: null })}
    >
      Add a course
    </Button>
  ) : null;

  let body;
  if (courses.isPending) body = <LoadingState label="Loading the curriculum…" />;
  else if (courses.isError) {
    body = (
      <ErrorState
        title="The curriculum could not be loaded."
        error={courses.error}
        onRetry={() => void courses.refetch()}
      />
    );
  } else if (courses.data.items.length === 0) {
    body = (
      <EmptyState
        icon={<BookIcon size={40} />}
        title={
          canEdit
            ? 'No courses yet. Add the course you teach from, then its numbered lessons.'
            : 'No courses yet. The family adds them here.'
        }
        action={addButton}
      />
    );
  } else {
    body = (
      <div className="wb-stack">
        {courses.data.items.map((course) => (
          <CourseSection
            key={course.id}
            course={course}
            canEdit={canEdit}
            onEditCourse={onEditCourse}
            onDeleteCourse={onDeleteCourse}
            onEditLesson={onEditLesson}
            onDeleteLesson={onDeleteLesson}
          />
        ))}
      </div>
    );
  }

  return (
    <>
      <div className="wb-page-head">
        <div>
          <h1 className="wb-page-title">Curriculum</h1>
          <p className="wb-muted">
            The courses you teach from and their numbered lessons. Answer keys point back to these
            lessons, so a missed item says which lessons to revisit.
          </p>
        </div>
        {courses.isSuccess && courses.data.items.length > 0 ? addButton : null}
      </div>
      {body}
      <CourseDialog
        open={courseDialog.open}
        course={courseDialog.course}
        onClose={() => setCourseDialog((current) => ({ ...current, open: false }))}
      />
      <LessonDialog lesson={editingLesson} onClose={() => setEditingLesson(null)} />
      <ConfirmDeleteAlert
        isOpen={deleting !== null}
        onClose={() => setDeleting(null)}
        onConfirm={() =>
          deleting?.kind === 'course'
            ? deleteCourse.mutateAsync(deleting.course.id)
            : deleting?.kind === 'lesson'
              ? deleteLesson.mutateAsync(deleting.lesson)
              : Promise.resolve()
        }
        onDeleted={() => {
          toast(
            deleting?.kind === 'course'
              ? `Deleted ${deleting.course.name}.`
              : `Deleted lesson ${deleting?.kind === 'lesson' ? deleting.lesson.number : ''}.`,
          );
          setDeleting(null);
        }}
      >
        {deleting?.kind === 'course' ? (
          <p>
            Delete <strong>{deleting.course.name}</strong> and its lessons? This cannot be undone.
          </p>
        ) : deleting?.kind === 'lesson' ? (
          <p>
            Delete lesson <strong>{deleting.lesson.number}</strong>, “{deleting.lesson.title}”?
          </p>
        ) : null}
      </ConfirmDeleteAlert>
    </>
  );
}
