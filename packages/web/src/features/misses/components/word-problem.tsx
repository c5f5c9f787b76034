import { Button, Radio, RadioGroup } from '@blueprintjs/core';
import { ChevronDownIcon, ChevronRightIcon } from '@blueprintjs/icons';
import {
  INTERVIEW_STAGE_GUIDE,
  INTERVIEW_STAGES,
  lineVerdict,
  MISS_KIND_LABEL,
  type CheckedLines,
  type InterviewStage,
  type MissKind,
} from '@workback/core';
import type { UseFormRegisterReturn } from 'react-hook-form';

import { TextAreaField } from '../../../components/form/text-area-field';
import { isApiError } from '../../../lib/api-client';
import './word-problem.css';

/**
 * The five interview prompts, in our own words, after Newman's error analysis (Newman 1977;
 * White 2005 for the interview in practice): the first one the child cannot do is where the
 * word problem went wrong.
 */
export const STAGE_PROMPTS = INTERVIEW_STAGE_GUIDE;

/** `stageLabel('process')` → `'Doing the arithmetic'`. */
export const stageLabel = (stage: InterviewStage): string => STAGE_PROMPTS[stage].stage;

/**
 * The kind a notebook row shows, the one the kind filter matches: `'Money'`, and for a word
 * problem with its stage `'Word problem: doing the arithmetic'`.
 */
export function kindText(kind: MissKind | undefined, stage: InterviewStage | null | undefined) {
  if (!kind) return '';
  return kind === 'word' && stage
    ? `${MISS_KIND_LABEL.word}: ${stageLabel(stage).toLowerCase()}`
    : MISS_KIND_LABEL[kind];
}

/** The textarea's text as the lines the API takes: trimmed, blank lines left out. */
export function readLines(text: string): string[] {
  return text
    .split('\n')
    .map((l) => l.trim())
    .filter((l) => l !== '');
}

/** Most number sentences and longest sentence the server keeps (the API's MAX_LINES, MAX_LINE_LENGTH). */
const MAX_LINES = 20;
const MAX_LINE_LENGTH = 120;

/** The form's check of the lines box, the same in the log form and the edit dialog. */
export function validateLines(text: string): true | string {
  const lines = readLines(text);
  if (lines.length > MAX_LINES) return `Keep it to ${MAX_LINES} number sentences or fewer.`;
  const long = lines.findIndex((l) => [...l].length > MAX_LINE_LENGTH);
  if (long >= 0) return `Line ${long + 1}: keep each sentence under ${MAX_LINE_LENGTH} characters.`;
  return true;
}

/** The API names a bad line `lines.2` (the third); the form shows it under the lines box. */
export function placeLineErrors(error: unknown): unknown {
  if (!isApiError(error)) return error;
  for (const [name, message] of Object.entries(error.fields)) {
    const index = /^lines\.(\d+)$/.exec(name)?.[1];
    if (index === undefined) continue;
    delete error.fields[name];
    error.fields.lines ??= `Line ${Number(index) + 1}: ${message}`;
  }
  return error;
}

/** The "Word problem" part of the log form and the edit dialog: collapsed until asked for. */
export function WordProblemFields({
  open,
  onOpen,
  registration,
  error,
  stage,
  onStageChange,
  disabled,
  idPrefix = 'miss',
}: {
  open: boolean;
  onOpen: (open: boolean) => void;
  registration: UseFormRegisterReturn;
  error?: string;
  stage: InterviewStage | '';
  onStageChange: (stage: InterviewStage | '') => void;
  disabled?: boolean;
  idPrefix?: string;
}) {
  const titleId = `${idPrefix}-word-title`;
  const bodyId = `${idPrefix}-word-body`;
  return (
    <section className="wb-word-problem" aria-labelledby={titleId}>
      <Button
        variant="minimal"
        id={titleId}
        aria-expanded={open}
        aria-controls={bodyId}
        icon={open ? <ChevronDownIcon /> : <ChevronRightIcon />}
        onClick={() => onOpen(!open)}
      >
        Word problem
      </Button>
      {open ? (
        <div id={bodyId}>
          <TextAreaField
            idPrefix={idPrefix}
            label="The number sentences the child wrote"
            rows={3}
            placeholder={'4 x 15 = 60\n60 - 18 = 42'}
            help="One per line, as written. The checkers look at each line’s arithmetic; whether the sentences answer the question stays your call."
            registration={registration}
            error={error}
          />
          <RadioGroup
            className="wb-word-stages"
            name={`${idPrefix}-stage`}
            label="Ask in turn; where did it go wrong?"
            selectedValue={stage}
            disabled={disabled}
            onChange={(event) => onStageChange(event.currentTarget.value as InterviewStage | '')}
          >
            {INTERVIEW_STAGES.map((s) => (
              <Radio
                key={s}
                value={s}
                labelElement={
                  <span>
                    “{STAGE_PROMPTS[s].prompt}”{' '}
                    <span className="wb-muted">— {STAGE_PROMPTS[s].stage.toLowerCase()}</span>
                  </span>
                }
              />
            ))}
            <Radio value="" labelElement={<span className="wb-muted">Not asked yet</span>} />
          </RadioGroup>
        </div>
      ) : null}
    </section>
  );
}

/** Each number sentence with what the checkers found; the first that differs marked softly. */
export function LinesCheckView({
  check,
  lines,
  stage,
}: {
  check: CheckedLines | null | undefined;
  lines: readonly string[];
  stage: InterviewStage | null | undefined;
}) {
  return (
    <>
      {check?.ok ? (
        <ol className="wb-word-lines" aria-label="Number sentences">
          {check.lines.map((l) => {
            const first = l.line === check.firstWrongLine;
            return (
              <li key={l.line} className={`wb-word-line${first ? ' wb-word-line-first' : ''}`}>
                <span className="wb-word-line-number">{l.line}.</span>
                <span className="wb-mono">{l.text}</span>
                <span className="wb-word-line-verdict">{lineVerdict(l, check.firstWrongLine)}</span>
              </li>
            );
          })}
        </ol>
      ) : (
        <ol className="wb-word-lines" aria-label="Number sentences">
          {lines.map((text, i) => (
            <li key={i} className="wb-word-line">
              <span className="wb-word-line-number">{i + 1}.</span>
              <span className="wb-mono">{text}</span>
            </li>
          ))}
        </ol>
      )}
      <p className="wb-muted">
        {stage
          ? `Where it went wrong: “${STAGE_PROMPTS[stage].prompt}” (${STAGE_PROMPTS[stage].stage.toLowerCase()}).`
          : 'No interview stage recorded.'}{' '}
        Each line’s arithmetic is checked; whether they answer the question is your call.
      </p>
    </>
  );
}
