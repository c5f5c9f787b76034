import { readRevisit } from '@workback/core';
import { fieldsError } from '../common/pipes/validation.pipe.js';
import type { KeyItem } from './models/key-item.model.js';

/** The lessons of a key's course, for checking the lessons its items revisit. */
export type CourseLessons = { numbers: Set<number>; courseName: string } | null;

export type ItemFields = Pick<
  KeyItem,
  'number' | 'prompt' | 'answer' | 'skills' | 'revisit' | 'facts'
>;
export const ITEM_FIELDS = ['number', 'prompt', 'answer', 'skills', 'revisit', 'facts'] as const;

/**
 * The checks class-validator cannot make: revisit entries, lessons the course has,
 * numbers used once. Throws one 400 listing every problem (with `known` ones from earlier).
 */
export function checkItems(
  items: readonly {
    number: number;
    prompt: string;
    answer: string;
    skills?: readonly string[];
    revisit?: readonly string[];
    facts?: readonly string[];
  }[],
  lessons: CourseLessons,
  where: (index: number) => string,
  known: Record<string, string> = {},
  noun: 'item' | 'row' = 'item',
): ItemFields[] {
  const errors: Record<string, string> = { ...known };
  const numbers = new Map<number, number>();
  const out = items.map((item, index) => {
    const at = where(index);
    if (typeof item.number === 'number' && !errors[`${at}.number`]) {
      const first = numbers.get(item.number);
      if (first !== undefined) {
        errors[`${at}.number`] = `number ${item.number} is used twice (first at ${where(first)})`;
      } else numbers.set(item.number, index);
    }
    let revisit: string[] = [];
    if (!errors[`${at}.revisit`]) {
      const read = readRevisit(item.revisit ?? []);
      if (!read.ok) errors[`${at}.revisit`] = read.message;
      else {
        revisit = read.entries;
        const unknown = lessons ? read.lessons.filter((n) => !lessons.numbers.has(n)) : [];
        if (unknown.length) {
          errors[`${at}.revisit`] =
            `${unknown.length === 1 ? 'lesson' : 'lessons'} ${unknown.join(', ')} ${unknown.length === 1 ? 'is' : 'are'} not in “${lessons!.courseName}”`;
        }
      }
    }
    return {
      number: item.number,
      prompt: item.prompt,
      answer: item.answer,
      skills: dedupe(item.skills ?? []),
      revisit,
      facts: dedupe(item.facts ?? []),
    };
  });
  if (Object.keys(errors).length > 0) {
    throw noun === 'row' ? itemsError(errors, 'row', 'imported') : itemsError(errors);
  }
  return out;
}

const dedupe = (list: readonly string[]) => [...new Set(list)];

/** One 400 naming every bad item (`items.3.answer`) or CSV row (`line 5.answer`). */
export function itemsError(fields: Record<string, string>, noun = 'item', verb = 'saved') {
  const count = new Set(Object.keys(fields).map((k) => k.split('.').slice(0, -1).join('.'))).size;
  const error = fieldsError(fields);
  const response = error.getResponse() as { message: string };
  const plural = count === 1 ? `${noun} has` : `${noun}s have`;
  response.message = `${count} ${plural} problems; nothing was ${verb}. ${response.message}`;
  return error;
}
