import { Callout, Intent } from '@blueprintjs/core';

import type { CsvProblem } from '../utils/read-key-csv';

const FIELD_LABEL: Readonly<Record<string, string>> = {
  number: 'item number',
  prompt: 'problem',
  answer: 'answer',
  skills: 'skills',
  revisit: 'lessons to revisit',
  facts: 'fact family',
  columns: 'columns',
  header: 'header',
  file: 'file',
};

const fieldLabel = (field: string) => FIELD_LABEL[field] ?? field;

/** Every problem of a CSV by line and field, as the preview or the API found them. */
export function CsvProblems({
  title,
  problems,
  hint,
}: {
  title: string;
  problems: readonly CsvProblem[];
  hint: string;
}) {
  return (
    <Callout intent={Intent.WARNING} title={title} className="wb-csv-problems" role="alert">
      <p>{hint}</p>
      <ul aria-label="Problems in the file">
        {problems.map((problem) => (
          <li key={`${problem.line}.${problem.field}`}>
            {problem.line > 0 ? <strong>Line {problem.line}</strong> : <strong>File</strong>}
            {problem.field === 'file' ? '' : `, ${fieldLabel(problem.field)}`}: {problem.message}
          </li>
        ))}
      </ul>
    </Callout>
  );
}
