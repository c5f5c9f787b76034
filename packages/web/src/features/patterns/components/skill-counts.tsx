import type { SkillCount } from '@workback/core';
import { Link } from 'react-router-dom';

import { notebookHref } from '../notebook-link';
import { shortDay } from '../types';

/** The skills of the answer keys with the most misses, each leading to those misses. */
export function SkillCounts({
  skills,
  studentId,
  from,
  to,
}: {
  skills: readonly SkillCount[];
  studentId: number;
  from: string | null;
  to: string | null;
}) {
  if (skills.length === 0) {
    return (
      <p className="wb-empty-line">
        No skills yet: misses logged from an answer key carry the skills of its items.
      </p>
    );
  }
  return (
    <ul className="wb-rule-counts" aria-label="Skills with the most misses">
      {skills.slice(0, 8).map((s) => (
        <li key={s.skill}>
          <span>{s.skill}</span>{' '}
          <Link to={notebookHref({ studentId, skill: s.skill, from, to })}>
            {s.count === 1 ? '1 miss' : `${s.count} misses`}
          </Link>{' '}
          <span className="wb-muted">last {shortDay(s.lastSeen)}</span>
        </li>
      ))}
    </ul>
  );
}
