import { RowActions, type RowActionHandlers } from '../../../components/row-actions';
import type { Lesson } from '../types';

export type LessonActionHandlers = RowActionHandlers<Lesson>;

export function LessonActions({ lesson, ...handlers }: { lesson: Lesson } & LessonActionHandlers) {
  return <RowActions row={lesson} name={`lesson ${lesson.number}`} {...handlers} />;
}
