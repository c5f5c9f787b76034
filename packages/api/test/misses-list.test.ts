import { readFileSync } from 'node:fs';
import { getConnectionToken } from '@nestjs/sequelize';
import { CAUSES, MISS_STATUSES, RULE_GROUPS } from '@workback/core';
import { QueryTypes } from 'sequelize';
import type { Sequelize } from 'sequelize-typescript';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import * as search0014 from '../src/database/migrations/0014-miss-search-by-household.js';
import * as search0015 from '../src/database/migrations/0015-miss-search-merged.js';
import { studentIds } from './support/photos.js';
import {
  type Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

interface Seeded {
  id: number;
  studentId: number;
  occurredOn: string;
  cause: string;
  status: string;
  problem: string;
  explanation: string;
  skills: string[];
  ruleIds: string[];
}

let t: TestApp;
let parent: Client;
let seeded: Seeded[];
let ada: number;
let bo: number;

// sub.borrow-from-zero: 1300 − 522 written 878, the 0 made a 9 (the rule catalog's own example).
const ZERO_FAMILY = RULE_GROUPS[0]!.ruleIds;

const PROBLEMS: [string, string][] = [
  ['304 - 75', '139'],
  ['81 - 38', '57'],
  ['58 + 67', '115'],
  ['A jar holds 50% more beans than a cup. How many?', '12'],
  ['46 + 38', '74'],
  ['1300 - 522', '878'],
];

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  parent = await registered(t, 'lists@example.test', 'List household');
  ada = (await parent.post('/api/students', { name: 'Ada', gradeLevel: '3' }).expect(201)).body.id;
  bo = (await parent.post('/api/students', { name: 'Bo', gradeLevel: '5' }).expect(201)).body.id;
  seeded = [];
  for (let i = 0; i < 30; i++) {
    const [problem, answer] = PROBLEMS[i % PROBLEMS.length]!;
    const res = await parent.post('/api/misses', {
      studentId: i % 3 === 0 ? bo : ada,
      occurredOn: `2025-01-${String(1 + (i % 20)).padStart(2, '0')}`,
      problem,
      answer,
      explanation: i % 6 === 0 ? `I carried the one, take ${i}` : `take ${i}: I_forgot`,
      cause: CAUSES[i % CAUSES.length],
      status: MISS_STATUSES[i % MISS_STATUSES.length],
      skills: i % 4 === 0 ? ['skill.alpha'] : ['skill.beta', 'skill.gamma'],
    });
    expect(res.status, res.text).toBe(201);
    seeded.push(res.body as Seeded);
  }
});
afterAll(() => t.close());

async function ids(query: string): Promise<number[]> {
  const res = await parent.get(`/api/misses?pageSize=100&${query}`);
  expect(res.status, res.text).toBe(200);
  expect(res.body.total).toBe(res.body.items.length);
  return (res.body.items as { id: number }[]).map((m) => m.id).sort((a, b) => a - b);
}

const idsWhere = (keep: (m: Seeded) => boolean) =>
  seeded
    .filter(keep)
    .map((m) => m.id)
    .sort((a, b) => a - b);

describe('GET /api/misses filters', () => {
  it('lists only this household’s misses', async () => {
    expect(await ids('')).toEqual(idsWhere(() => true));
  });

  it.each([
    ['studentId', () => `studentId=${bo}`, (m: Seeded) => m.studentId === bo],
    ['cause', () => 'cause=fact', (m: Seeded) => m.cause === 'fact'],
    ['status', () => 'status=planned', (m: Seeded) => m.status === 'planned'],
    [
      'rule',
      () => 'rule=sub.borrow-across-zero',
      (m: Seeded) => m.ruleIds.some((r) => r.split('+').includes('sub.borrow-across-zero')),
    ],
    [
      'a family of rules (a Patterns card’s)',
      () => 'rule=group:zero-regrouping',
      (m: Seeded) => m.ruleIds.some((r) => r.split('+').some((id) => ZERO_FAMILY.includes(id))),
    ],
    ['skill', () => 'skill=skill.gamma', (m: Seeded) => m.skills.includes('skill.gamma')],
    [
      'from and to (inclusive)',
      () => 'from=2025-01-05&to=2025-01-09',
      (m: Seeded) => m.occurredOn >= '2025-01-05' && m.occurredOn <= '2025-01-09',
    ],
    ['q over the explanation', () => 'q=CARRIED', (m: Seeded) => m.explanation.includes('carried')],
    ['q over the problem', () => 'q=jar', (m: Seeded) => m.problem.includes('jar')],
    [
      'q with a literal %',
      () => `q=${encodeURIComponent('50%')}`,
      (m: Seeded) => m.problem.includes('50%'),
    ],
    ['q with a literal _', () => 'q=I_f', (m: Seeded) => m.explanation.includes('I_f')],
    [
      'q of two characters (too short for the index)',
      () => 'q=Ja',
      (m: Seeded) => `${m.problem} ${m.explanation}`.toLowerCase().includes('ja'),
    ],
    [
      'several at once',
      () => `studentId=${ada}&cause=slip&from=2025-01-01`,
      (m: Seeded) => m.studentId === ada && m.cause === 'slip',
    ],
  ])('filters by %s', async (_name, query, keep) => {
    const expected = idsWhere(keep);
    expect(expected.length).toBeGreaterThan(0);
    expect(expected.length).toBeLessThan(seeded.length);
    expect(await ids(query())).toEqual(expected);
  });

  it('sends query text to SQL as bound values, quotes and $ included', async () => {
    const e = encodeURIComponent;
    for (const query of [
      `rule=${e("x' OR '1'='1")}`,
      `skill=${e("') OR 1=1 --")}`,
      `q=${e("zz' OR 'a'='a")}`,
      `q=${e('$rule')}`,
      `q=${e('"; DROP TABLE misses; --')}`,
    ]) {
      expect(await ids(query), query).toEqual([]);
    }
    // A full page counts the rest with the same bound values.
    const borrow = idsWhere((m) =>
      m.ruleIds.some((r) => r.split('+').includes('sub.borrow-across-zero')),
    );
    expect(borrow.length).toBeGreaterThan(1);
    const page = await parent.get('/api/misses?pageSize=1&rule=sub.borrow-across-zero&q=a');
    expect(page.status, page.text).toBe(200);
    expect(page.body.items).toHaveLength(1);
  });

  it('keeps the text search in step with edits and deletions', async () => {
    const target = seeded.find((m) => m.problem.includes('jar'))!;
    const search = async (q: string) => ids(`q=${encodeURIComponent(q)}`);
    expect(await search('holds 50%')).toContain(target.id);
    await parent
      .send('patch', `/api/misses/${target.id}`, { explanation: 'I counted the marbles twice' })
      .expect(200);
    target.explanation = 'I counted the marbles twice';
    expect(await search('marbles twice')).toEqual([target.id]);
    const extra = await parent
      .post('/api/misses', {
        studentId: ada,
        occurredOn: '2025-02-01',
        problem: '7 x 8',
        answer: '54',
        explanation: 'zebra crossing words',
        cause: 'fact',
      })
      .expect(201);
    expect(await search('ZEBRA cross')).toEqual([extra.body.id]);
    await parent.send('delete', `/api/misses/${extra.body.id}`).expect(204);
    expect(await search('zebra')).toEqual([]);
  });

  it('searches only the household’s own misses, however many other households match', async () => {
    const demo = await signedIn(t, DEMO.owner);
    const demoStudent = [...(await studentIds(demo)).values()][0]!;
    const words = 'quokka tally marks';
    const theirs = await demo
      .post('/api/misses', {
        studentId: demoStudent,
        occurredOn: '2025-02-02',
        problem: '9 x 6',
        answer: '56',
        explanation: words,
        cause: 'fact',
      })
      .expect(201);
    const ours = await parent
      .post('/api/misses', {
        studentId: ada,
        occurredOn: '2025-02-02',
        problem: '9 x 6',
        answer: '56',
        explanation: words,
        cause: 'fact',
      })
      .expect(201);
    expect(await ids('q=QUOKKA')).toEqual([ours.body.id]);
    const other = await demo.get('/api/misses?pageSize=100&q=quokka').expect(200);
    expect(other.body.items.map((m: { id: number }) => m.id)).toEqual([theirs.body.id]);
    await parent.send('delete', `/api/misses/${ours.body.id}`).expect(204);
    await demo.send('delete', `/api/misses/${theirs.body.id}`).expect(204);
    expect(await ids('q=quokka')).toEqual([]);
  });

  it('finds a miss by the words of its skills, any case, only in the household', async () => {
    const zeros = await parent
      .post('/api/misses', {
        studentId: ada,
        occurredOn: '2025-02-03',
        problem: '1300 - 522',
        answer: '888',
        explanation: 'the middle was hard',
        cause: 'concept',
        skills: ['subtraction', 'regrouping across zeros'],
      })
      .expect(201);
    // The demo household's misses carry the same skill; the search stays in this household.
    const demo = await signedIn(t, DEMO.owner);
    const theirs = await demo.get('/api/misses?pageSize=100&q=regrouping%20across%20zeros');
    expect(theirs.body.items.length).toBeGreaterThan(0);
    expect(theirs.body.items.map((m: { id: number }) => m.id)).not.toContain(zeros.body.id);
    expect(await ids('q=Regrouping%20across%20ZEROS')).toEqual([zeros.body.id]);
    expect(await ids('q=cross')).toEqual([zeros.body.id]); // inside a word, past the trigram index
    expect(await ids('q=gamma')).toEqual(idsWhere((m) => m.skills.includes('skill.gamma')));
    // Each skill is compared, not the array's JSON: its quotes and commas match nothing.
    expect(await ids(`q=${encodeURIComponent('","')}`)).toEqual([]);
    expect(await ids(`q=${encodeURIComponent('zeros"]')}`)).toEqual([]);
    await parent.send('delete', `/api/misses/${zeros.body.id}`).expect(204);
    expect(await ids('q=across%20zeros')).toEqual([]);
  });

  it('rebuilds the text search from the misses when migration 0014 runs on a filled database', async () => {
    const qi = t.app.get<Sequelize>(getConnectionToken()).getQueryInterface();
    const before = await ids('q=carried');
    expect(before).toEqual(idsWhere((m) => m.explanation.includes('carried')));
    // Back to 0006's table keyed by id, then 0014 again: its index is made from the rows.
    // On PostgreSQL both are no-ops and the pg_trgm search answers the same.
    await search0014.down({ context: qi });
    await search0014.up({ context: qi });
    expect(await ids('q=carried')).toEqual(before);
  });

  it('merges the text search into one segment (migration 0015) and finds the same misses', async () => {
    const sequelize = t.app.get<Sequelize>(getConnectionToken());
    const sqlite = sequelize.getDialect() === 'sqlite';
    // FTS5 keeps the entries of each write apart (a segment) until it merges them; each row of
    // misses_search_idx names one segment's leaf page (SQLite's FTS5 documentation).
    const segments = async () => {
      const [row] = await sequelize.query<{ n: number }>(
        'SELECT COUNT(DISTINCT segid) AS n FROM misses_search_idx',
        { type: QueryTypes.SELECT },
      );
      return Number(row!.n);
    };
    // Another household's misses, each logged on its own (a write, a segment), so this
    // household's lists are as the other tests expect them.
    const other = await registered(t, 'segments@example.test', 'Segments household');
    const cy = await other.post('/api/students', { name: 'Cy', gradeLevel: '4' }).expect(201);
    for (let i = 0; i < 3; i++) {
      await other
        .post('/api/misses', {
          studentId: cy.body.id,
          occurredOn: '2025-02-01',
          problem: '72 - 48',
          answer: '36',
          explanation: `try ${i}: I took the small digit from the big one`,
        })
        .expect(201);
    }
    const theirs = async (q: string) => {
      const res = await other.get(`/api/misses?pageSize=100&q=${q}`).expect(200);
      return (res.body.items as { id: number }[]).map((m) => m.id).sort((a, b) => a - b);
    };
    const before = { ours: await ids('q=carried'), theirs: await theirs('small%20digit') };
    expect(before.theirs).toHaveLength(3);
    if (sqlite) expect(await segments()).toBeGreaterThan(1);

    await search0015.up({ context: sequelize.getQueryInterface() });

    if (sqlite) expect(await segments()).toBe(1);
    // Searches not asked before, so no kept page answers them: the merged index does.
    expect({ ours: await ids('q=carried%20the'), theirs: await theirs('digit%20from') }).toEqual(
      before,
    );
  });

  it('finds the rule in the diagnosis of the seeded borrow-across-zero misses', () => {
    // 304 − 75 written 139: BORROW-ACROSS-ZERO (Brown & Burton 1978; from memory).
    const borrow = seeded.filter((m) => m.problem === '304 - 75');
    expect(borrow.every((m) => m.ruleIds[0] === 'sub.borrow-across-zero')).toBe(true);
    // So the family filter above gathers two of the family's rules.
    const fromZero = seeded.filter((m) => m.problem === '1300 - 522');
    expect(fromZero.map((m) => m.ruleIds[0])).toEqual(fromZero.map(() => 'sub.borrow-from-zero'));
  });

  it('gives list rows without the full diagnosis, with the thumbnail photo id', async () => {
    const res = await parent.get('/api/misses?pageSize=1').expect(200);
    expect(res.body.items[0]).not.toHaveProperty('diagnosis');
    expect(res.body.items[0]).toMatchObject({ thumbnailPhotoId: null, photoCount: 0 });
    const demo = await signedIn(t, DEMO.owner);
    // Every miss of the demo scenario (seeds/demo-misses.json) carries one drawn photo.
    const scenario = JSON.parse(
      readFileSync(new URL('../../../seeds/demo-misses.json', import.meta.url), 'utf8'),
    ) as { misses: unknown[] };
    const all = await demo.get('/api/misses?pageSize=100').expect(200);
    const withPhotos = all.body.items.filter((m: { photoCount: number }) => m.photoCount > 0);
    expect(withPhotos.length).toBeGreaterThanOrEqual(scenario.misses.length);
    for (const item of withPhotos.slice(0, 5)) {
      expect(item.thumbnailPhotoId).toEqual(expect.any(Number));
      await demo.get(`/api/photos/${item.thumbnailPhotoId}/thumb`).expect(200);
    }
  });
});

describe('GET /api/misses paging and sorting', () => {
  it('pages through every miss once, with the total on each page', async () => {
    const seen: number[] = [];
    for (let page = 1; page <= 5; page++) {
      const res = await parent.get(`/api/misses?pageSize=7&page=${page}`).expect(200);
      expect(res.body).toMatchObject({ total: 30, page, pageSize: 7 });
      expect(res.body.items).toHaveLength(page < 5 ? 7 : 2);
      seen.push(...res.body.items.map((m: { id: number }) => m.id));
    }
    expect([...seen].sort((a, b) => a - b)).toEqual(idsWhere(() => true));
    const past = await parent.get('/api/misses?pageSize=7&page=6').expect(200);
    expect(past.body).toMatchObject({ items: [], total: 30 });
  });

  it('defaults to 25 a page, newest day first (then newest id)', async () => {
    const res = await parent.get('/api/misses').expect(200);
    expect(res.body.pageSize).toBe(25);
    expect(res.body.items).toHaveLength(25);
    const expected = [...seeded]
      .sort((a, b) => b.occurredOn.localeCompare(a.occurredOn) || b.id - a.id)
      .slice(0, 25)
      .map((m) => m.id);
    expect(res.body.items.map((m: { id: number }) => m.id)).toEqual(expected);
  });

  it.each([
    [
      'occurredOn',
      (a: Seeded, b: Seeded) => a.occurredOn.localeCompare(b.occurredOn) || a.id - b.id,
    ],
    ['-problem', (a: Seeded, b: Seeded) => cmp(b.problem, a.problem) || b.id - a.id],
    ['cause', (a: Seeded, b: Seeded) => cmp(a.cause, b.cause) || a.id - b.id],
    ['createdAt', (a: Seeded, b: Seeded) => a.id - b.id],
    ['-createdAt', (a: Seeded, b: Seeded) => b.id - a.id],
  ])('sorts by %s', async (sort, compare) => {
    const res = await parent.get(`/api/misses?pageSize=100&sort=${sort}`).expect(200);
    expect(res.body.items.map((m: { id: number }) => m.id)).toEqual(
      [...seeded].sort(compare).map((m) => m.id),
    );
  });
});

// SQLite compares text by bytes (BINARY collation); so does this.
const cmp = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

describe('GET /api/misses bad queries', () => {
  it.each([
    ['pageSize=101', 'pageSize'],
    ['pageSize=0', 'pageSize'],
    ['page=0', 'page'],
    ['page=two', 'page'],
    ['sort=name', 'sort'],
    ['cause=lazy', 'cause'],
    ['status=done', 'status'],
    ['from=2025-13-01', 'from'],
    ['from=2025-02-01&to=2025-01-01', 'to'],
    ['studentId=abc', 'studentId'],
    ['color=red', 'color'],
  ])('refuses %s naming %s', async (query, field) => {
    const res = await parent.get(`/api/misses?${query}`).expect(400);
    expect(res.body.fields).toHaveProperty(field);
  });

  it('answers 404 for a student of another household', async () => {
    const demo = await signedIn(t, DEMO.owner);
    const wren = (await studentIds(demo)).get('Wren')!;
    await parent.get(`/api/misses?studentId=${wren}`).expect(404);
  });
});

describe('GET /api/misses for a tutor', () => {
  it('lists only the granted student’s misses and 404s the other student', async () => {
    const owner = await signedIn(t, DEMO.owner);
    const names = await studentIds(owner);
    const tutor = await signedIn(t, DEMO.tutor);
    const all = await owner.get('/api/misses?pageSize=100').expect(200);
    const wrens = all.body.items.filter(
      (m: { studentId: number }) => m.studentId === names.get('Wren'),
    );
    const mine = await tutor.get('/api/misses?pageSize=100').expect(200);
    expect(mine.body.total).toBe(wrens.length);
    expect(new Set(mine.body.items.map((m: { studentId: number }) => m.studentId))).toEqual(
      new Set([names.get('Wren')]),
    );
    await tutor.get(`/api/misses?studentId=${names.get('Milo')}`).expect(404);
  });
});
