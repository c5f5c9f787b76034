import type { WrittenStepsReport } from '@workback/core';

import './written-steps.css';

/**
 * The partial products or long-division lines the child wrote, each beside the usual one,
 * the first that differs marked softly; a right step says so, a wrong one says what the
 * checkers make of it on its own.
 */
export function WrittenSteps({ report }: { report: WrittenStepsReport }) {
  const what = report.kind === 'partials' ? 'partial products' : 'division lines';
  return (
    <figure className="wb-written-steps">
      <figcaption>The {what} the child wrote, beside the usual ones</figcaption>
      <table className="wb-written-table" aria-label={`The ${what} the child wrote`}>
        <thead>
          <tr>
            <th scope="col">Step</th>
            <th scope="col">Works out</th>
            <th scope="col">Child wrote</th>
            <th scope="col">Usual</th>
            <th scope="col">
              <span className="wb-visually-hidden">Same or not</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {report.steps.map((s, i) => {
            const first = report.firstDiffers === i;
            return (
              <tr key={s.label} className={first ? 'wb-written-first' : undefined}>
                <th scope="row">{s.label}</th>
                <td className="wb-mono">{s.work || '—'}</td>
                <td className="wb-mono" data-label="wrote">
                  {s.written || 'nothing'}
                </td>
                <td className="wb-mono" data-label="usual">
                  {s.expected || 'none'}
                </td>
                <td>
                  {s.ok ? 'same' : first ? 'the first that differs' : 'differs'}
                  {s.finding ? (
                    <span className="wb-written-why"> — {s.finding.explanation}</span>
                  ) : null}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </figure>
  );
}
