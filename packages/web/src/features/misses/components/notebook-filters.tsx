import { Button, FormGroup, HTMLSelect, InputGroup } from '@blueprintjs/core';
import { FilterIcon, SearchIcon } from '@blueprintjs/icons';
import {
  CAUSE_GUIDE,
  CAUSES,
  INTERVIEW_STAGES,
  MISS_KIND_LABEL,
  MISS_KINDS,
  MISS_STATUSES,
  RULE_GROUPS,
  RULES,
  ruleName,
} from '@workback/core';
import { useEffect, useState } from 'react';

import { SORTS, type FilterParams } from '../hooks/use-notebook-filters';
import { statusLabel, type StudentOption } from '../types';
import { stageLabel } from './word-problem';

const TYPING_DELAY_MS = 350;

/** A text filter that writes to the address bar once typing pauses. */
function TypedFilter({
  id,
  label,
  value,
  placeholder,
  onChange,
  search,
}: {
  id: string;
  label: string;
  value: string;
  placeholder: string;
  onChange: (value: string) => void;
  search?: boolean;
}) {
  const [text, setText] = useState(value);
  const [shownValue, setShownValue] = useState(value);
  // The URL changed underneath (cleared, or a link was opened): show what it says now.
  if (value !== shownValue) {
    setShownValue(value);
    setText(value);
  }
  useEffect(() => {
    if (text.trim() === value) return undefined;
    const timer = setTimeout(() => onChange(text.trim()), TYPING_DELAY_MS);
    return () => clearTimeout(timer);
  }, [text, value, onChange]);
  return (
    <FormGroup label={label} labelFor={id} className="wb-filter">
      <InputGroup
        id={id}
        type="search"
        value={text}
        placeholder={placeholder}
        leftIcon={search ? <SearchIcon /> : undefined}
        onValueChange={setText}
      />
    </FormGroup>
  );
}

function SelectFilter({
  id,
  label,
  value,
  options,
  onChange,
}: {
  id: string;
  label: string;
  value: string;
  options: readonly { value: string; label: string }[];
  onChange: (value: string) => void;
}) {
  return (
    <FormGroup label={label} labelFor={id} className="wb-filter">
      <HTMLSelect
        id={id}
        fill
        value={value}
        options={[...options]}
        onChange={(event) => onChange(event.currentTarget.value)}
      />
    </FormGroup>
  );
}

/** Every filter the server knows, written to the URL; folded behind one button on phones. */
export function NotebookFilters({
  students,
  value,
  set,
  clear,
  active,
  compact,
}: {
  students: readonly StudentOption[];
  value: (name: keyof FilterParams) => string;
  set: (changes: Partial<FilterParams>) => void;
  clear: () => void;
  active: number;
  compact: boolean;
}) {
  const [open, setOpen] = useState(false);
  const shown = !compact || open;
  return (
    <div className="wb-filters">
      <div className="wb-filters-top">
        <TypedFilter
          id="filter-q"
          label="Search"
          search
          value={value('q')}
          placeholder="Words in the problem or what the child said"
          onChange={(q) => set({ q })}
        />
        <SelectFilter
          id="filter-sort"
          label="Order"
          value={value('sort') || SORTS[0].value}
          options={SORTS}
          onChange={(sort) => set({ sort })}
        />
      </div>
      {compact ? (
        <Button
          icon={<FilterIcon />}
          variant="outlined"
          aria-expanded={open}
          aria-controls="notebook-more-filters"
          onClick={() => setOpen((o) => !o)}
        >
          {open ? 'Hide filters' : active > 0 ? `Filters (${active} on)` : 'More filters'}
        </Button>
      ) : null}
      {shown ? (
        <div className="wb-filters-grid" id="notebook-more-filters">
          <SelectFilter
            id="filter-student"
            label="Student"
            value={value('student')}
            options={[
              { value: '', label: 'Every student' },
              ...students.map((s) => ({ value: String(s.id), label: s.name })),
            ]}
            onChange={(student) => set({ student })}
          />
          <SelectFilter
            id="filter-cause"
            label="Cause"
            value={value('cause')}
            options={[
              { value: '', label: 'Any cause' },
              ...CAUSES.map((c) => ({ value: c, label: CAUSE_GUIDE[c].label })),
            ]}
            onChange={(cause) => set({ cause })}
          />
          <SelectFilter
            id="filter-status"
            label="Status"
            value={value('status')}
            options={[
              { value: '', label: 'Any status' },
              ...MISS_STATUSES.map((s) => ({ value: s, label: statusLabel(s) })),
            ]}
            onChange={(status) => set({ status })}
          />
          <SelectFilter
            id="filter-kind"
            label="Kind of problem"
            value={value('kind')}
            options={[
              { value: '', label: 'Any kind' },
              ...MISS_KINDS.map((k) => ({ value: k, label: MISS_KIND_LABEL[k] })),
            ]}
            onChange={(kind) => set({ kind })}
          />
          <SelectFilter
            id="filter-stage"
            label="Word problem went wrong at"
            value={value('stage')}
            options={[
              { value: '', label: 'Any stage' },
              ...INTERVIEW_STAGES.map((s) => ({ value: s, label: stageLabel(s) })),
            ]}
            onChange={(stage) => set({ stage })}
          />
          <SelectFilter
            id="filter-rule"
            label="Step error"
            value={value('rule')}
            options={[
              { value: '', label: 'Any step error' },
              ...RULES.map((r) => ({ value: r.id, label: ruleName(r.id) })),
              ...RULE_GROUPS.map((g) => ({
                value: `group:${g.group}`,
                label: `${g.title}: any of its ${g.ruleIds.length} step errors`,
              })),
            ]}
            onChange={(rule) => set({ rule })}
          />
          <TypedFilter
            id="filter-skill"
            label="Skill"
            value={value('skill')}
            placeholder="e.g. regrouping across zeros"
            onChange={(skill) => set({ skill })}
          />
          <FormGroup label="From" labelFor="filter-from" className="wb-filter">
            <InputGroup
              id="filter-from"
              type="date"
              value={value('from')}
              onValueChange={(from) => set({ from })}
            />
          </FormGroup>
          <FormGroup label="To" labelFor="filter-to" className="wb-filter">
            <InputGroup
              id="filter-to"
              type="date"
              value={value('to')}
              onValueChange={(to) => set({ to })}
            />
          </FormGroup>
          {active > 0 ? (
            <div className="wb-filter wb-filter-clear">
              <Button variant="minimal" onClick={clear}>
                Clear filters
              </Button>
            </div>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
