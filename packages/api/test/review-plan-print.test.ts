import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import { extractText, getDocumentProxy } from 'unpdf';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseProblem } from '@workback/core';
import type { ReviewPlanJson } from '../src/review-plans/review-plans.service.js';
import { printedProblem } from '../src/review-plans/review-plan-pdf.js';
import { waitForMail } from './support/mail.js';
import { DEMO, signedIn, startTestApp, type Client, type TestApp } from './support/test-app.js';

// Issue 11 §5 and §8: a review plan never misleads, reads summary first, prints as people
// write, and the sample key fits the demo course.

let t: TestApp;
let owner: Client;
let student: number;
let plan: ReviewPlanJson;
let pdf: Buffer;
const SCREENSHOTS = path.resolve(import.meta.dirname, '../../../.screenshots');

async function pages(body: Buffer): Promise<string[]> {
  const doc = await getDocumentProxy(new Uint8Array(body));
  const { text } = await extractText(doc, { mergePages: false });
  return text as string[];
}

const binary = (res: import('superagent').Response, cb: (e: Error | null, b: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function miss(occurredOn: string, problem: string, answer: string, extra: object = {}) {
  const res = await owner.post('/api/misses', {
    studentId: student,
    occurredOn,
    problem,
    answer,
    ...extra,
  });
  if (res.status !== 201) throw new Error(`miss: ${res.status} ${res.text}`);
  return res.body.id as number;
}

beforeAll(async () => {
  t = await startTestApp({
    SIGN_IN_LIMIT_PER_MINUTE: '1000',
    PUBLIC_URL: 'https://workback.example.test/',
  });
  owner = await signedIn(t, DEMO.owner);
  student = (
    await owner.post('/api/students', { name: 'Print child', gradeLevel: '3' }).expect(201)
  ).body.id as number;
  // DESIGN.md's catalog examples: 304 − 75 → 139 (sub.borrow-across-zero), 1300 − 522 → 878
  // (sub.borrow-from-zero); 4006 − 989 = 3017; 7 × 8 = 56 and 8 + 7 = 15 (basic facts).
  await miss('2026-11-30', '304 - 75', '139', {
    revisit: ['14'],
    explanation: 'I took the one from the 3.',
  });
  await miss('2026-12-01', '1300 - 522', '878', { revisit: ['14', '15'] });
  await miss('2026-12-01', '4006 - 989', '3127', { revisit: ['15'] });
  await miss('2026-12-02', '7 x 8', '54', { revisit: ['13'] });
  await miss('2026-12-02', '58 + 67', '115', { revisit: ['4'] });
  // Issue 11's example: 347 × 26 answered 8,922 with partials 2,082 and 6,840 (347 × 20 = 6,940).
  await miss('2026-12-03', '347 x 26', '8922', { steps: { partials: ['2082', '6840'] } });
  // Marked wrong, but the engine works 304 − 75 out as 229: nothing to re-work.
  await miss('2026-12-02', '304 - 75', '229', { revisit: ['8'] });
  const res = await owner.post('/api/review-plans', {
    studentId: student,
    scheduledFor: '2026-12-04',
  });
  expect(res.status, res.text).toBe(201);
  plan = res.body;
  pdf = (
    await owner
      .get(`/api/review-plans/${plan.id}/export.pdf`)
      .buffer(true)
      .parse(binary)
      .expect(200)
  ).body as Buffer;
});
afterAll(() => t.close());

describe('a plan never misleads', () => {
  it('never asks to re-work an answer the engine finds right, and says why it is left out', async () => {
    expect(plan.misses.map((m) => `${m.problem} ${m.answer}`)).not.toContain('304 - 75 229');
    expect(plan.items.filter((i) => i.kind === 'miss')).toHaveLength(6);
    expect(plan.notes.join(' ')).toMatch(/304 - 75 answered 229 is right by the checker/);
    // Lesson 8 was asked for only by the right answer: it is not on the plan.
    expect(plan.lessons.ranges.map((r) => [r.from, r.to])).toEqual([
      [4, 4],
      [13, 15],
    ]);
    const right = (await owner.get(`/api/misses?studentId=${student}&status=logged`).expect(200))
      .body.items as { answer: string }[];
    expect(right.map((m) => m.answer)).toEqual(['229']);
  });

  it('refuses a plan of right answers only, naming missIds, and saves nothing', async () => {
    const id = await miss('2026-12-02', '58 + 67', '125');
    const before = (await owner.get(`/api/review-plans?studentId=${student}`).expect(200)).body
      .total;
    const res = await owner.post('/api/review-plans', {
      studentId: student,
      scheduledFor: '2026-12-05',
      missIds: [id],
    });
    expect(res.status).toBe(400);
    expect(res.body.fields.missIds).toMatch(/right by the checker/);
    expect((await owner.get(`/api/review-plans?studentId=${student}`).expect(200)).body.total).toBe(
      before,
    );
  });

  it('drills each family with its own table and offers other activities', () => {
    const eights = plan.factFamilies.find((f) => f.family === 'x8')!;
    expect(eights.facts).toEqual(['7 × 8']);
    const all = [eights.activity, ...(eights.alternatives ?? [])];
    expect(all.length).toBeGreaterThanOrEqual(3);
    const skip = all.find((a) => a.id === 'skip-counting')!;
    expect(skip.how).toContain('(8, 16, 24, …)');
    expect(skip.how).toContain('56 is 7 × 8');
    for (const a of all) expect(a.how).not.toMatch(/7, 14, 21|42 is 6 × 7/);
  });

  it('names lessons by their curriculum titles, merging only lessons asked for', () => {
    // Titles from seeds/demo-curriculum.json, the household's one course.
    expect(plan.items.filter((i) => i.kind === 'lesson').map((i) => i.title)).toEqual([
      'Revisit lesson 4 “Adding two-digit numbers”',
      'Revisit lessons 13–15: 13 “Facts: eights and nines”, 14 “Regrouping across a zero”, 15 “Regrouping across two or more zeros”',
    ]);
  });

  it('puts 3–5 problems first, chosen by recurrence', () => {
    const focus = plan.summary.focus;
    expect(focus.length).toBeGreaterThanOrEqual(3);
    expect(focus.length).toBeLessThanOrEqual(5);
    // Three misses regroup across zeros: that difficulty leads.
    expect(focus[0]!.recurs).toBe(3);
    expect(focus[0]!.reason).toMatch(/regrouping across zeros/);
  });

  it('carries lesson titles into the CSV', async () => {
    const res = await owner.get(`/api/review-plans/${plan.id}/export.csv`).expect(200);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows.filter((r) => r.section === 'lessons').map((r) => r.item)).toEqual(
      plan.items.filter((i) => i.kind === 'lesson').map((i) => i.title),
    );
  });
});

describe('the printed plan', () => {
  it('opens with a one-page summary: lessons, facts, the problems most worth re-working', async () => {
    const [first, ...rest] = await pages(pdf);
    expect(first).toContain('Review plan for Print child');
    expect(first).toContain('Review day 4 December 2026');
    expect(first).toContain('Lesson 4 “Adding two-digit numbers”');
    expect(first).toContain('× and ÷ facts with 8: 7 × 8');
    expect(first).toContain('Problems most worth re-working');
    for (const f of plan.summary.focus) expect(first).toContain(f.reason);
    expect(first).not.toContain('Practice problems');
    expect(rest.join('\n')).toContain('Practice problems');
  });

  it('writes dates as people do, labels every figure and numbers problems so they cannot be misread', async () => {
    const text = (await pages(pdf)).join('\n');
    expect(text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
    expect(text).toContain('30 November 2026');
    expect(text).toContain('Child wrote 139 · right answer 229');
    expect(text).toContain('Child wrote 3127 · right answer 3017');
    const n = plan.misses.findIndex((m) => m.problem === '4006 - 989') + 1;
    expect(text).toContain(`${n}. 4006 − 989`);
    expect(text).toMatch(/The right working · answer 229/);
    expect(text).not.toMatch(/→|tens 0 > 10 > 9/);
    for (const p of plan.practice.flatMap((b) => b.problems))
      expect(text).toContain(`${p.number}. ${printedProblem(p.problem)} = ${p.answer}`);
  });

  it('draws the partial products the child wrote and marks the first that differs', async () => {
    const text = (await pages(pdf)).join('\n');
    expect(text).toContain('The partial products the child wrote, beside the usual ones:');
    expect(text).toMatch(
      /partial product 2 \(347 × 2[^)]*\): wrote 6840 · usual 6940 · the first that differs/,
    );
  });

  it('prints an unchanged plan from its kept copy, and a changed plan afresh', async () => {
    const download = async () =>
      (
        await owner
          .get(`/api/review-plans/${plan.id}/export.pdf`)
          .buffer(true)
          .parse(binary)
          .expect(200)
      ).body as Buffer;
    // The kept bytes, creation time and all.
    expect((await download()).equals(pdf)).toBe(true);
    const move = (scheduledFor: string) =>
      owner.send('patch', `/api/review-plans/${plan.id}`, { scheduledFor }).expect(200);
    await move('2026-12-05');
    expect((await pages(await download()))[0]).toContain('Review day 5 December 2026');
    await move('2026-12-04');
    expect((await pages(await download()))[0]).toContain('Review day 4 December 2026');
  });

  it('renders to PNG pages with pdftoppm (Debian poppler-utils)', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'plan-png-'));
    const file = path.join(dir, 'plan.pdf');
    writeFileSync(file, pdf);
    execFileSync('pdftoppm', ['-png', '-r', '60', file, path.join(dir, 'page')]);
    const pngs = readdirSync(dir)
      .filter((f) => f.endsWith('.png'))
      .sort();
    expect(pngs.length).toBeGreaterThanOrEqual(3);
    for (const p of pngs) {
      const bytes = readFileSync(path.join(dir, p));
      expect(bytes.subarray(1, 4).toString()).toBe('PNG');
      expect(statSync(path.join(dir, p)).size).toBeGreaterThan(5_000);
    }
    // Kept for a person to look at (git-ignored).
    execFileSync('mkdir', ['-p', SCREENSHOTS]);
    execFileSync('pdftoppm', ['-png', '-r', '80', file, path.join(SCREENSHOTS, 'plan-pdf')]);
  });

  it('e-mails say where the answers are and link back to the plan from PUBLIC_URL', async () => {
    const members = (await owner.get('/api/members').expect(200)).body.items as {
      id: number;
      email: string;
    }[];
    const parent = members.find((m) => m.email === DEMO.parent)!;
    await owner
      .post(`/api/review-plans/${plan.id}/send`, { memberIds: [parent.id] })
      .set('Host', 'evil.example.test')
      .expect(200);
    const mail = await waitForMail(
      owner,
      DEMO.parent,
      /Review plan for Print child, 4 December 2026/,
    );
    expect(mail.text).toContain(
      'Where the answers are: at the end of the PDF, from the page headed “Answers”',
    );
    expect(mail.text).toContain('Lesson 4 “Adding two-digit numbers”');
    expect(mail.links).toContain(`https://workback.example.test/review-plans/${plan.id}`);
    expect(mail.text).not.toContain('evil.example.test');
  });
});

describe('the sample key and the demo course', () => {
  it('links every item of fixtures/keys/sample-key.csv to lessons whose titles fit it', async () => {
    const course = (await owner.get('/api/courses').expect(200)).body.items[0] as { id: number };
    const lessons = (await owner.get(`/api/courses/${course.id}/lessons`).expect(200)).body
      .items as {
      number: number;
      title: string;
    }[];
    const file = readFileSync(new URL('../../../fixtures/keys/sample-key.csv', import.meta.url));
    const res = await owner.agent
      .post('/api/answer-keys/import')
      .set('x-csrf-token', owner.token)
      .field('title', 'Sample key')
      .field('kind', 'worksheet')
      .field('courseId', String(course.id))
      .attach('file', file, { filename: 'sample-key.csv', contentType: 'text/csv' });
    expect(res.status, res.text).toBe(201);
    // What each kind of problem is taught under in the demo course (its own titles).
    const fits: Record<string, RegExp> = {
      addition: /add/i,
      subtraction: /subtract|regroup/i,
      multiplication: /multipl|partial|facts/i,
      division: /divi|quotient|facts/i,
      rounding: /round/i,
      missing: /missing/i,
      word: /word|facts/i,
    };
    for (const item of res.body.items as { prompt: string; revisitLessons: number[] }[]) {
      const parsed = parseProblem(item.prompt);
      const kind = parsed.ok ? parsed.problem.kind : 'word';
      expect(item.revisitLessons.length, item.prompt).toBeGreaterThan(0);
      for (const n of item.revisitLessons) {
        const title = lessons.find((l) => l.number === n)?.title ?? '(none)';
        expect(title, `${item.prompt} → lesson ${n}`).toMatch(fits[kind]!);
      }
    }
  });
});
