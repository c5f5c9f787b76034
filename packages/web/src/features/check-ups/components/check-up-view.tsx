import { Button, Callout, Card, Tag } from '@blueprintjs/core';
import { DocumentIcon, PrintIcon } from '@blueprintjs/icons';

import { LinkButton } from '../../../components/link-button';
import { paths } from '../../../config/paths';
import { useDownloadCheckUp } from '../api/download-check-up';
import type { CheckUp } from '../types';
import { CheckUpAnswersForm } from './check-up-answers-form';
import '../check-ups.css';

const STATUS: Record<CheckUp['status'], { label: string; intent: 'none' | 'primary' | 'success' }> =
  {
    'not taken': { label: 'Not taken yet', intent: 'none' },
    confirmed: { label: 'Settled', intent: 'success' },
    open: { label: 'Still open', intent: 'primary' },
  };

/** What each explanation writes on one problem, merged where two write the same. */
function writers(checkUp: CheckUp, answers: Record<string, string>): [string, string[]][] {
  const by = new Map<string, string[]>();
  for (const h of checkUp.hypotheses) {
    const answer = answers[h.id] as string;
    by.set(answer, [...(by.get(answer) ?? []), h.name]);
  }
  return [...by];
}

/**
 * A check-up: the explanations it tells apart, the two sheets to print, then either the grid
 * for the child's answers or what the answers said.
 */
export function CheckUpView({
  checkUp,
  studentName,
  canEnter,
}: {
  checkUp: CheckUp;
  studentName: string;
  /** Owners and parents enter the answers; a tutor reads. */
  canEnter: boolean;
}) {
  const download = useDownloadCheckUp();
  const status = STATUS[checkUp.status];
  const nameOf = (id: string) => checkUp.hypotheses.find((h) => h.id === id)?.name ?? id;
  return (
    <>
      <h1 className="wb-page-title">
        Check-up for {studentName}{' '}
        <Tag intent={status.intent} round>
          {status.label}
        </Tag>
      </h1>
      <Card className="wb-panel">
        <p>
          {checkUp.problems.length} problems chosen so that each explanation below would write
          different answers on at least two of them:
        </p>
        <ul>
          {checkUp.hypotheses.map((h) => (
            <li key={h.id}>{h.name}</li>
          ))}
        </ul>
        {checkUp.merged.map((m) => (
          <p key={m.id} className="wb-muted">
            {m.reason}
          </p>
        ))}
        <div className="wb-checkup-buttons">
          <Button
            icon={<PrintIcon />}
            onClick={() => download.mutate({ id: checkUp.id, which: 'sheet' })}
            loading={download.isPending && download.variables?.which === 'sheet'}
          >
            Sheet for {studentName} (PDF)
          </Button>
          <Button
            icon={<DocumentIcon />}
            variant="outlined"
            onClick={() => download.mutate({ id: checkUp.id, which: 'answers' })}
            loading={download.isPending && download.variables?.which === 'answers'}
          >
            What each answer means (PDF)
          </Button>
        </div>
        <p className="wb-muted">
          Give it on a calm day, away from the test. The answers are an aid to your judgement, not a
          grade.
        </p>
      </Card>

      {checkUp.reading === null ? (
        canEnter ? (
          <CheckUpAnswersForm checkUp={checkUp} />
        ) : (
          <Callout intent="none">A parent enters the answers once the check-up is done.</Callout>
        )
      ) : (
        <Card className="wb-panel" role="region" aria-labelledby="check-up-reading">
          <h2 id="check-up-reading" className="wb-subhead">
            What the answers say
          </h2>
          <p>{checkUp.reading.sentence}</p>
          {checkUp.reading.confirmed !== null ? (
            <p>
              <strong>Fits:</strong> {nameOf(checkUp.reading.confirmed)}
            </p>
          ) : null}
          {checkUp.reading.ruledOut.length > 0 ? (
            <p>
              <strong>Ruled out:</strong> {checkUp.reading.ruledOut.map(nameOf).join('; ')}
            </p>
          ) : null}
          <table className="wb-checkup-table">
            <thead>
              <tr>
                <th scope="col">Problem</th>
                <th scope="col">Child wrote</th>
                <th scope="col">Each explanation would write</th>
              </tr>
            </thead>
            <tbody>
              {checkUp.problems.map((p, i) => {
                const wrote = checkUp.reading?.answers[i] ?? null;
                return (
                  <tr key={p.problem}>
                    <td className="wb-checkup-sheet" data-label="Problem">
                      {i + 1}. {p.problem}
                    </td>
                    <td className="wb-checkup-sheet" data-label="Child wrote">
                      {wrote ?? '—'}
                    </td>
                    <td data-label="Would write">
                      {writers(checkUp, p.answers).map(([answer, names]) => (
                        <div
                          key={answer}
                          className={wrote === answer ? 'wb-checkup-fits' : undefined}
                        >
                          <span className="wb-checkup-sheet">{answer}</span> · {names.join('; ')}
                        </div>
                      ))}
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
          {checkUp.sittingId !== null ? (
            <p>
              <LinkButton to={paths.app.sittingMisses.getHref(checkUp.sittingId)} outlined>
                Misses from this check-up
              </LinkButton>
            </p>
          ) : null}
          {checkUp.reading.verdict === 'open' ? (
            <p className="wb-muted">
              A second check-up, on another calm day, can tell the open explanations apart.
            </p>
          ) : null}
        </Card>
      )}
    </>
  );
}
