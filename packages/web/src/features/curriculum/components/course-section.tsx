import { Button, Card } from '@blueprintjs/core';
import { EditIcon, TrashIcon } from '@blueprintjs/icons';
import { useMemo } from 'react';

import { useTableFits } from '../../../components/list-table';
import { ErrorState, LoadingState } from '../../../components/states';
import { useLessons } from '../api/get-lessons';
import type { Course, Lesson } from '../types';
import { LessonCards } from './lesson-cards';
import { LESSONS_TABLE_FITS_QUERY, LessonsTable } from './lessons-table';
import { QuickAddLesson } from './quick-add-lesson';

type CourseSectionProps = {
  course: Course;
  canEdit: boolean;
  onEditCourse: (course: Course) => void;
  onDeleteCourse: (course: Course) => void;
  onEditLesson: (lesson: Lesson) => void;
  onDeleteLesson: (lesson: Lesson) => void;
};

/** One course: its name, its numbered lessons, and a line to add the next lesson. */
export function CourseSection({
  course,
  canEdit,
  onEditCourse,
  onDeleteCourse,
  onEditLesson,
  onDeleteLesson,
}: CourseSectionProps) {
  const lessons = useLessons(course.id);
  const tableFits = useTableFits(LESSONS_TABLE_FITS_QUERY);
  const actions = useMemo(
    () => (canEdit ? { onEdit: onEditLesson, onDelete: onDeleteLesson } : undefined),
    [canEdit, onEditLesson, onDeleteLesson],
  );
  const headingId = `course-${course.id}-title`;

  let body;
  if (lessons.isPending) body = <LoadingState label="Loading lessons…" />;
  else if (lessons.isError) {
    body = (
      <ErrorState
        title="The lessons could not be loaded."
        error={lessons.error}
        onRetry={() => void lessons.refetch()}
      />
    );
  } else if (lessons.data.items.length === 0) {
    body = (
      <p className="wb-muted wb-course-empty">
        {canEdit
          ? 'No lessons yet. Add lesson 1 below — a number and a title is enough.'
          : 'No lessons in this course yet.'}
      </p>
    );
  } else if (tableFits) {
    body = <LessonsTable courseName={course.name} lessons={lessons.data.items} actions={actions} />;
  } else {
    body = <LessonCards courseName={course.name} lessons={lessons.data.items} actions={actions} />;
  }

  const last = lessons.data?.items.at(-1)?.number ?? 0;

  return (
    <section aria-labelledby={headingId}>
      <Card className="wb-course">
        <div className="wb-course-head">
          <div>
            <h2 id={headingId} className="wb-subhead">
              {course.name}
            </h2>
            <p className="wb-muted">
              {[course.level, `${course.lessonCount} lesson${course.lessonCount === 1 ? '' : 's'}`]
                .filter(Boolean)
                .join(' · ')}
            </p>
          </div>
          {canEdit ? (
            <span className="wb-row-actions">
              <Button
                size="small"
                variant="minimal"
                icon={<EditIcon />}
                onClick={() => onEditCourse(course)}
                aria-label={`Rename ${course.name}`}
              >
                Rename
              </Button>
              <Button
                size="small"
                variant="minimal"
                icon={<TrashIcon />}
                onClick={() => onDeleteCourse(course)}
                aria-label={`Delete ${course.name}`}
              >
                Delete
              </Button>
            </span>
          ) : null}
        </div>
        {body}
        {canEdit && lessons.isSuccess ? (
          <QuickAddLesson course={course} nextNumber={last + 1} />
        ) : null}
      </Card>
    </section>
  );
}
