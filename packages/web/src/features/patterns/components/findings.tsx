import { Card, Tag } from '@blueprintjs/core';
import type { Contradiction, MissEvidence, RuleFinding } from '@workback/core';
import { Link } from 'react-router-dom';

import { paths } from '../../../config/paths';
import { notebookHref } from '../notebook-link';
import { shortDay, type PatternsResult } from '../types';

const SHOWN = 8;

function More({ total }: { total: number }) {
  return total > SHOWN ? <li className="wb-muted">and {total - SHOWN} more</li> : null;
}

function EvidenceList({ evidence }: { evidence: readonly MissEvidence[] }) {
  return (
    <ul className="wb-evidence">
      {evidence.slice(0, SHOWN).map((e) => (
        <li key={e.missId}>
          <Link to={paths.app.miss.getHref(e.missId)}>
            <span className="wb-mono">
              {e.problem} → {e.answer}
            </span>
          </Link>{' '}
          <span className="wb-muted">{shortDay(e.occurredOn)}</span>
        </li>
      ))}
      <More total={evidence.length} />
    </ul>
  );
}

function Contradictions({
  items,
  studentName,
}: {
  items: readonly Contradiction[];
  studentName: string;
}) {
  if (items.length === 0) return null;
  return (
    <details className="wb-details wb-contradictions">
      <summary>
        {items.length === 1
          ? `1 answer ${studentName} got right goes against it`
          : `${items.length} answers ${studentName} got right go against it`}
      </summary>
      <p className="wb-muted">Where {studentName} was right, the rule would have written:</p>
      <ul className="wb-evidence">
        {items.slice(0, SHOWN).map((c) => (
          <li key={`${c.occurredOn}-${c.problem}`}>
            <span className="wb-mono">
              {c.problem} = {c.answer}
            </span>{' '}
            <span className="wb-muted">
              (the rule writes <span className="wb-mono">{c.ruleWrites}</span>,{' '}
              {shortDay(c.occurredOn)})
            </span>
          </li>
        ))}
        <More total={items.length} />
      </ul>
    </details>
  );
}

function RuleCard({
  finding,
  patterns,
  studentName,
}: {
  finding: RuleFinding;
  patterns: PatternsResult;
  studentName: string;
}) {
  const isFinding = finding.status === 'finding';
  const misses = finding.explains === 1 ? '1 miss' : `${finding.explains} misses`;
  return (
    <Card className="wb-finding-card">
      <div className="wb-finding-head">
        <Tag minimal round className={isFinding ? 'wb-finding-tag' : 'wb-possible-tag'}>
          {isFinding ? 'Finding' : 'Possible'}
        </Tag>
        <span className="wb-finding-title">{finding.title}</span>
      </div>
      <p>
        This method reproduces{' '}
        <Link
          to={notebookHref({
            studentId: patterns.studentId,
            rule: finding.ruleId,
            from: patterns.from,
            to: patterns.to,
          })}
        >
          {misses}
        </Link>{' '}
        exactly
        {finding.inPairs > 0
          ? `, and ${finding.inPairs} more together with another rule`
          : ''}.{' '}
        {isFinding
          ? 'None of the answers the child got right goes against it.'
          : finding.contradictions.length > 0
            ? ''
            : 'One miss is not enough to call it a habit yet.'}
      </p>
      <details className="wb-details">
        <summary>The misses it explains</summary>
        <EvidenceList evidence={finding.evidence} />
      </details>
      <Contradictions items={finding.contradictions} studentName={studentName} />
    </Card>
  );
}

/**
 * What the step checkers found across problems: rules that explain several misses and no right
 * answer goes against (findings), and the rest (possible).
 */
export function Findings({
  patterns,
  studentName,
}: {
  patterns: PatternsResult;
  studentName: string;
}) {
  const { rules, groups } = patterns.findings;
  if (rules.length === 0 && groups.length === 0) {
    return (
      <p className="wb-empty-line">
        No written-method rule explains these misses. Slips, facts and misreads do not show here.
      </p>
    );
  }
  return (
    <>
      {groups.map((group) => (
        <Card key={group.group} className="wb-finding-card wb-finding-group">
          <div className="wb-finding-head">
            <Tag
              minimal
              round
              className={group.status === 'finding' ? 'wb-finding-tag' : 'wb-possible-tag'}
            >
              {group.status === 'finding' ? 'Finding' : 'Possible'}
            </Tag>
            <span className="wb-finding-title">{group.title}</span>
          </div>
          <p>{group.sentence}</p>
          <details className="wb-details">
            <summary>The misses ({group.evidence.length})</summary>
            <EvidenceList evidence={group.evidence} />
          </details>
          <Contradictions items={group.contradictions} studentName={studentName} />
        </Card>
      ))}
      <ul className="wb-cards" aria-label="Rules the checkers tried">
        {rules.map((finding) => (
          <li key={finding.ruleId}>
            <RuleCard finding={finding} patterns={patterns} studentName={studentName} />
          </li>
        ))}
      </ul>
    </>
  );
}
