import { FormGroup, HTMLSelect, InputGroup } from '@blueprintjs/core';

import { PERIODS, type Period } from '../period';
import type { StudentRef } from '../types';

export type PatternFilterValues = {
  studentId: number;
  period: Period;
  from: string;
  to: string;
};

/** Whose patterns, over which days. Plain native controls: easy on a phone. */
export function PatternFilters({
  students,
  value,
  onChange,
}: {
  students: readonly StudentRef[];
  value: PatternFilterValues;
  onChange: (changes: Partial<PatternFilterValues>) => void;
}) {
  return (
    <div className="wb-pattern-filters">
      <FormGroup label="Student" labelFor="patterns-student">
        <HTMLSelect
          id="patterns-student"
          value={String(value.studentId)}
          onChange={(e) => onChange({ studentId: Number(e.currentTarget.value) })}
          options={students.map((s) => ({ value: String(s.id), label: s.name }))}
        />
      </FormGroup>
      <FormGroup label="Period" labelFor="patterns-period">
        <HTMLSelect
          id="patterns-period"
          value={value.period}
          onChange={(e) => onChange({ period: e.currentTarget.value as Period })}
          options={PERIODS.map((p) => ({ value: p.value, label: p.label }))}
        />
      </FormGroup>
      {value.period === 'custom' ? (
        <>
          <FormGroup label="From" labelFor="patterns-from">
            <InputGroup
              id="patterns-from"
              type="date"
              value={value.from}
              onValueChange={(from) => onChange({ from })}
            />
          </FormGroup>
          <FormGroup label="To" labelFor="patterns-to">
            <InputGroup
              id="patterns-to"
              type="date"
              value={value.to}
              onValueChange={(to) => onChange({ to })}
            />
          </FormGroup>
        </>
      ) : null}
    </div>
  );
}
