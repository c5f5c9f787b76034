import { Card } from '@blueprintjs/core';

import type { Lesson } from '../types';
import { LessonActions, type LessonActionHandlers } from './lesson-actions';

/** The same lessons as cards, for phones. */
export function LessonCards({
  courseName,
  lessons,
  actions,
}: {
  courseName: string;
  lessons: readonly Lesson[];
  actions?: LessonActionHandlers;
}) {
  return (
    <ul className="wb-cards" aria-label={`Lessons of ${courseName}`}>
      {lessons.map((lesson) => (
        <li key={lesson.id}>
          <Card className="wb-card">
            <div className="wb-card-main">
              <span className="wb-card-title">
                {lesson.number}. {lesson.title}
              </span>
              {lesson.skills.length > 0 ? (
                <span className="wb-muted">{lesson.skills.join(', ')}</span>
              ) : null}
            </div>
            {actions ? <LessonActions lesson={lesson} {...actions} /> : null}
          </Card>
        </li>
      ))}
    </ul>
  );
}
