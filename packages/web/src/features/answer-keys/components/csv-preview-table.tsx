import { checkItem } from '../utils/check-item';
import type { CsvProblem, PreviewRow } from '../utils/read-key-csv';

/** The rows read from a CSV before anything is uploaded; on phones each row is a card. */
export function CsvPreviewTable({
  rows,
  problems,
}: {
  rows: readonly PreviewRow[];
  problems: readonly CsvProblem[];
}) {
  const badLines = new Set(problems.map((p) => p.line));
  return (
    <div className="wb-rtable-wrap">
      <table className="wb-rtable" aria-label="Items read from the file">
        <thead>
          <tr>
            <th scope="col">Line</th>
            <th scope="col">No.</th>
            <th scope="col">Problem</th>
            <th scope="col">Answer</th>
            <th scope="col">Lessons to revisit</th>
            <th scope="col">Check</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((row) => {
            const check = checkItem(row.prompt, row.answer);
            return (
              <tr
                key={row.line}
                className={badLines.has(row.line) ? 'wb-row-attention' : undefined}
              >
                <td data-label="Line" className="wb-muted">
                  {row.line}
                </td>
                <td data-label="No." className="wb-cell-strong">
                  {row.number}
                </td>
                <td data-label="Problem" className="wb-digits">
                  {row.prompt}
                </td>
                <td data-label="Answer" className="wb-digits">
                  {row.answer || '—'}
                </td>
                <td data-label="Lessons to revisit">{row.revisit.join('; ') || '—'}</td>
                <td data-label="Check">
                  {check.status === 'agrees' ? (
                    <span className="wb-muted">Checker agrees</span>
                  ) : check.status === 'not-checked' ? (
                    <span className="wb-muted">Not checked</span>
                  ) : (
                    <span className="wb-flag">{check.message}</span>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
