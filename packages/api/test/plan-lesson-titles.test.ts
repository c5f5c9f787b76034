import { Role } from '@workback/core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AnswerKeysService } from '../src/answer-keys/answer-keys.service.js';
import type { MemberContext } from '../src/common/member-context.js';
import { CurriculumService } from '../src/curriculum/curriculum.service.js';
import { type Client, registered, startTestApp, type TestApp } from './support/test-app.js';

/**
 * A plan's lesson titles come from the courses of its misses' answer keys, the most used course
 * first; where two courses number a lesson alike, the first course's title is the one shown.
 * Both reads are single joined queries, so these pin what the per-course reads answered.
 */
let t: TestApp;
let home: MemberContext;
let other: MemberContext;
let first: number;
let second: number;
let elsewhere: number;
let firstItems: number[];
let secondItems: number[];

async function memberOf(client: Client): Promise<MemberContext> {
  const household = (await client.get('/api/households/current').expect(200)).body as {
    id: number;
  };
  return {
    userId: 0,
    membershipId: 0,
    householdId: household.id,
    role: Role.owner,
    studentIds: null,
  };
}

async function course(client: Client, name: string, lessons: [number, string][]) {
  const made = await client.post('/api/courses', { name });
  expect(made.status, made.text).toBe(201);
  for (const [number, title] of lessons) {
    const res = await client.post(`/api/courses/${made.body.id}/lessons`, { number, title });
    expect(res.status, res.text).toBe(201);
  }
  return made.body.id as number;
}

async function keyItems(client: Client, courseId: number, problems: [string, string][]) {
  const res = await client.post('/api/answer-keys', {
    title: `Sheet for course ${courseId}`,
    kind: 'worksheet',
    courseId,
    items: problems.map(([prompt, answer], i) => ({ number: i + 1, prompt, answer })),
  });
  expect(res.status, res.text).toBe(201);
  return (res.body.items as { id: number }[]).map((i) => i.id);
}

beforeAll(async () => {
  t = await startTestApp();
  const owner = await registered(t, 'titles-owner@example.test', 'Titles household');
  const stranger = await registered(t, 'titles-stranger@example.test', 'Another household');
  home = await memberOf(owner);
  other = await memberOf(stranger);
  first = await course(owner, 'First course', [
    [12, 'Sevens, first course'],
    [14, 'Zeros, first course'],
  ]);
  second = await course(owner, 'Second course', [
    [12, 'Sevens, second course'],
    [13, 'Eights, second course'],
  ]);
  elsewhere = await course(stranger, 'Not theirs', [[12, 'Sevens, elsewhere']]);
  firstItems = await keyItems(owner, first, [['7 x 8', '56']]);
  secondItems = await keyItems(owner, second, [
    ['6 x 7', '42'],
    ['9 x 8', '72'],
  ]);
});
afterAll(() => t.close());

describe('a plan’s courses and lesson titles', () => {
  it('orders courses by how many distinct items of the misses each holds', async () => {
    const keys = t.app.get(AnswerKeysService);
    // The same item twice (two misses of one item) counts once.
    const items = [firstItems[0]!, firstItems[0]!, ...secondItems];
    expect(await keys.coursesOfItems(home, items)).toEqual([second, first]);
    expect(await keys.coursesOfItems(home, [firstItems[0]!, secondItems[0]!])).toEqual(
      [first, second].sort((a, b) => a - b),
    );
    expect(await keys.coursesOfItems(home, [])).toEqual([]);
    // Another household's member learns nothing of these keys.
    expect(await keys.coursesOfItems(other, items)).toEqual([]);
  });

  it('takes a shared lesson number’s title from the course named first, and only the household’s', async () => {
    const curriculum = t.app.get(CurriculumService);
    expect(await curriculum.lessonTitles(home, [second, first])).toEqual({
      12: 'Sevens, second course',
      13: 'Eights, second course',
      14: 'Zeros, first course',
    });
    expect(await curriculum.lessonTitles(home, [first, second])).toEqual({
      12: 'Sevens, first course',
      13: 'Eights, second course',
      14: 'Zeros, first course',
    });
    expect(await curriculum.lessonTitles(home, [elsewhere, second])).toEqual({
      12: 'Sevens, second course',
      13: 'Eights, second course',
    });
  });
});
