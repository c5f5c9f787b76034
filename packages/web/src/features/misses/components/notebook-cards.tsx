import { Card, Tag } from '@blueprintjs/core';
import { Link, useSearchParams } from 'react-router-dom';

import { paths } from '../../../config/paths';
import {
  causeLabel,
  formatDay,
  ruleTitle,
  shownRule,
  smallPhotoUrl,
  statusLabel,
  type MissSummary,
} from '../types';
import { kindText } from './word-problem';

/** The same misses as cards, for phones; each card opens its miss. */
export function NotebookCards({
  misses,
  studentName,
}: {
  misses: readonly MissSummary[];
  studentName: (id: number) => string;
}) {
  // The rule the list is filtered by, so each card names that rule (see shownRule).
  const filterRule = useSearchParams()[0].get('rule');
  return (
    <ul className="wb-cards" aria-label="Misses">
      {misses.map((miss) => (
        <li key={miss.id}>
          <Card className="wb-card wb-miss-card">
            {miss.thumbnailPhotoId ? (
              <img
                className="wb-thumb"
                src={smallPhotoUrl(miss.thumbnailPhotoId)}
                width={64}
                height={64}
                alt=""
                loading="lazy"
                decoding="async"
              />
            ) : (
              <span className="wb-thumb wb-thumb-none" aria-hidden="true" />
            )}
            <div className="wb-card-main">
              <Link
                className="wb-card-title wb-mono wb-row-link"
                to={paths.app.miss.getHref(miss.id)}
              >
                {miss.problem}
              </Link>
              <span className="wb-muted">
                answered <span className="wb-mono wb-pencil">{miss.answer}</span> ·{' '}
                {studentName(miss.studentId)} · {formatDay(miss.occurredOn)}
              </span>
              <span className="wb-card-tags">
                <Tag minimal round>
                  {causeLabel(miss.cause)}
                </Tag>
                <Tag minimal round>
                  {statusLabel(miss.status)}
                </Tag>
                {miss.kind ? (
                  <Tag minimal round className="wb-kind-tag">
                    {kindText(miss.kind, miss.stage)}
                  </Tag>
                ) : null}
                {shownRule(miss.ruleIds, filterRule) ? (
                  <span className="wb-muted">
                    {ruleTitle(shownRule(miss.ruleIds, filterRule)!)}
                  </span>
                ) : null}
              </span>
            </div>
          </Card>
        </li>
      ))}
    </ul>
  );
}
