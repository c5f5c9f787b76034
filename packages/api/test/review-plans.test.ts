import { parse } from 'csv-parse/sync';
import { extractText, getDocumentProxy } from 'unpdf';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ReviewPlanJson } from '../src/review-plans/review-plans.service.js';
import { outbox, waitForMail } from './support/mail.js';
import {
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type Client,
  type TestApp,
} from './support/test-app.js';

let t: TestApp;
let owner: Client;
let tutor: Client;
let stranger: Client;
let wren: number;
let milo: number;

async function pdfText(body: Buffer): Promise<string> {
  const doc = await getDocumentProxy(new Uint8Array(body));
  const { text } = await extractText(doc, { mergePages: true });
  return text;
}

const binary = (res: import('superagent').Response, cb: (e: Error | null, b: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function freshStudent(name: string): Promise<number> {
  const res = await owner.post('/api/students', { name, gradeLevel: '3' }).expect(201);
  return res.body.id as number;
}

async function miss(
  studentId: number,
  occurredOn: string,
  problem: string,
  answer: string,
  extra: object = {},
): Promise<number> {
  const res = await owner.post('/api/misses', { studentId, occurredOn, problem, answer, ...extra });
  if (res.status !== 201) throw new Error(`miss: ${res.status} ${res.text}`);
  return res.body.id as number;
}

const statusOf = async (id: number) =>
  (await owner.get(`/api/misses/${id}`).expect(200)).body.status;

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  tutor = await signedIn(t, DEMO.tutor);
  stranger = await registered(t, 'plans-stranger@example.test', 'Elsewhere');
  const students = (await owner.get('/api/students').expect(200)).body.items as {
    id: number;
    name: string;
  }[];
  wren = students.find((s) => s.name === 'Wren')!.id;
  milo = students.find((s) => s.name === 'Milo')!.id;
});
afterAll(() => t.close());

describe('the demo', () => {
  it('has one past review plan for Wren, worked through', async () => {
    const res = await owner.get(`/api/review-plans?studentId=${wren}`).expect(200);
    expect(res.body.total).toBe(1);
    expect(res.body.items[0]).toMatchObject({ status: 'done', studentId: wren });
    expect(res.body.items[0].progress.done).toBe(res.body.items[0].progress.total);
  });
});

describe('POST /api/review-plans', () => {
  let student: number;
  let ids: number[];
  let plan: ReviewPlanJson;

  beforeAll(async () => {
    student = await freshStudent('Plan child');
    ids = [
      // DESIGN.md's catalog example: 304 − 75 → 139 is sub.borrow-across-zero.
      await miss(student, '2026-02-02', '304 - 75', '139', {
        revisit: ['12', '13'],
        skills: ['regrouping'],
      }),
      await miss(student, '2026-02-03', '7 x 8', '54', { revisit: ['14', '20'] }),
      await miss(student, '2026-02-04', '605 - 48', '467', { revisit: ['13'] }),
    ];
  });

  it('builds a plan from the open misses: lessons merged, facts with activities, practice, planned misses', async () => {
    const res = await owner.post('/api/review-plans', {
      studentId: student,
      scheduledFor: '2026-02-06',
    });
    expect(res.status, res.text).toBe(201);
    plan = res.body;
    expect(plan.lessons.text).toBe('12–14, 20');
    expect(plan.factFamilies.map((f) => [f.family, f.facts])).toEqual([['x8', ['7 × 8']]]);
    expect(plan.factFamilies[0]!.activity.id).toBe('skip-counting');
    expect(plan.practice.map((p) => p.ruleId)).toEqual(['sub.borrow-across-zero']);
    expect(plan.practice[0]!.problems).toHaveLength(4);
    expect(plan.misses.map((m) => m.id)).toEqual(ids);
    expect(plan.misses[0]!.working!.expected.join('\n')).toContain('229');
    expect(plan.misses[0]!.working!.child!.join('\n')).toContain('139');
    expect(plan.items.map((i) => i.kind)).toEqual([
      'lesson',
      'lesson',
      'fact-family',
      'practice',
      'miss',
      'miss',
      'miss',
    ]);
    expect(plan.warning).toBeNull();
    expect(plan.covers).toContain('rule:sub.borrow-across-zero');
    for (const id of ids) expect(await statusOf(id)).toBe('planned');
  });

  it('keeps the practice problems the same on every read', async () => {
    const again = await owner.get(`/api/review-plans/${plan.id}`).expect(200);
    expect(again.body.practice).toEqual(plan.practice);
  });

  it('answers 422 when no open misses are left since the last plan', async () => {
    const res = await owner.post('/api/review-plans', {
      studentId: student,
      scheduledFor: '2026-02-09',
    });
    expect(res.status).toBe(422);
    expect(res.body.message).toMatch(/missIds/);
  });

  it('makes one plan of the open misses asked for five times at once (a double tap, two parents)', async () => {
    const child = await freshStudent('Tapped plan child');
    const missIds = [
      await miss(child, '2026-02-02', '304 - 75', '139', { revisit: ['12'] }),
      await miss(child, '2026-02-03', '7 x 8', '54', { revisit: ['14'] }),
    ];
    // On PostgreSQL each read the same last plan and open misses before any had made its plan.
    const sends = await Promise.all(
      Array.from({ length: 5 }, () =>
        owner.post('/api/review-plans', { studentId: child, scheduledFor: '2026-02-06' }),
      ),
    );
    expect(sends.map((r) => r.status).sort()).toEqual([201, 422, 422, 422, 422]);
    for (const refused of sends.filter((r) => r.status === 422))
      expect(refused.body.message).toMatch(/no open misses since the last plan.*missIds/);
    const made = sends.find((r) => r.status === 201)!.body as ReviewPlanJson;
    expect(made.misses.map((m) => m.id)).toEqual(missIds);
    const plans = await owner.get(`/api/review-plans?studentId=${child}`).expect(200);
    expect(plans.body.total).toBe(1);
    expect(plans.body.items[0].id).toBe(made.id);
    for (const id of missIds) expect(await statusOf(id)).toBe('planned');
  });

  it('warns when the review falls on the day of work it reviews', async () => {
    const res = await owner
      .post('/api/review-plans', {
        studentId: student,
        scheduledFor: '2026-02-03',
        missIds: [ids[1]],
      })
      .expect(201);
    expect(res.body.warning).toMatchObject({ code: 'same-day', dates: ['2026-02-03'] });
    expect(res.body.warning.message).toMatch(/calmer, separate day/);
  });

  it('resolves a miss when every item covering it is checked, and reopens it when one is unchecked', async () => {
    const items = plan.items as { id: number; kind: string; missIds: number[] }[];
    const first = ids[0]!;
    const covering = items.filter((i) => i.missIds.includes(first));
    expect(covering.length).toBeGreaterThan(1);
    const [last, ...rest] = covering;
    await owner
      .send('patch', `/api/review-plans/${plan.id}`, {
        items: rest.map((i) => ({ id: i.id, done: true })),
      })
      .expect(200);
    expect(await statusOf(first)).toBe('planned');
    const done = await owner
      .send('patch', `/api/review-plans/${plan.id}`, { items: [{ id: last!.id, done: true }] })
      .expect(200);
    expect(await statusOf(first)).toBe('resolved');
    expect(done.body.status).toBe('open');
    await owner
      .send('patch', `/api/review-plans/${plan.id}`, { items: [{ id: last!.id, done: false }] })
      .expect(200);
    expect(await statusOf(first)).toBe('planned');
  });

  it('is done when every item is checked', async () => {
    const res = await tutor.send('patch', `/api/review-plans/${plan.id}`, {
      items: plan.items.map((i) => ({ id: i.id, done: true })),
    });
    // The tutor is not given this new student: 404, and nothing changed.
    expect(res.status).toBe(404);
    const all = await owner
      .send('patch', `/api/review-plans/${plan.id}`, {
        items: plan.items.map((i) => ({ id: i.id, done: true })),
      })
      .expect(200);
    expect(all.body.status).toBe('done');
    expect(all.body.progress).toEqual({ done: 7, total: 7 });
    for (const id of ids) expect(await statusOf(id)).toBe('resolved');
  });

  it('refuses an item of another plan, naming it, and changes nothing', async () => {
    const before = (await owner.get(`/api/review-plans/${plan.id}`).expect(200)).body;
    const res = await owner.send('patch', `/api/review-plans/${plan.id}`, {
      items: [
        { id: plan.items[0]!.id, done: false },
        { id: 999_999, done: true },
      ],
    });
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({ 'items.1.id': 'item 999999 is not on this plan' });
    const after = (await owner.get(`/api/review-plans/${plan.id}`).expect(200)).body;
    expect(after.items).toEqual(before.items);
  });

  it('names bad fields', async () => {
    const res = await owner.post('/api/review-plans', {
      studentId: student,
      scheduledFor: '2026-02-30',
    });
    expect(res.status).toBe(400);
    expect(res.body.fields.scheduledFor).toMatch(/real calendar date/);
    const missing = await owner.post('/api/review-plans', { scheduledFor: '2026-03-01' });
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.fields)).toContain('studentId');
    const twice = await owner.post('/api/review-plans', {
      studentId: student,
      scheduledFor: '2026-03-01',
      missIds: [ids[0], ids[0]],
    });
    expect(twice.status).toBe(400);
    expect(twice.body.fields.missIds).toMatch(/twice/);
    const nulled = await owner.post('/api/review-plans', {
      studentId: student,
      scheduledFor: '2026-03-01',
      missIds: null,
    });
    expect(nulled.status).toBe(400);
    expect(Object.keys(nulled.body.fields)).toEqual(['missIds']);
  });

  it('refuses another student’s miss (400) and another household’s (404), leaving no plan behind', async () => {
    const other = await miss(milo, '2026-02-02', '81 - 38', '57');
    const before = (await owner.get(`/api/review-plans?studentId=${student}`).expect(200)).body
      .total;
    const mixed = await owner.post('/api/review-plans', {
      studentId: student,
      scheduledFor: '2026-03-01',
      missIds: [ids[0], other],
    });
    expect(mixed.status).toBe(400);
    expect(mixed.body.fields).toEqual({ 'missIds.1': `miss ${other} is another student’s` });
    const theirs = await stranger
      .post('/api/students', { name: 'Theirs', gradeLevel: '2' })
      .expect(201);
    const foreign = await stranger.post('/api/misses', {
      studentId: theirs.body.id,
      occurredOn: '2026-02-02',
      problem: '81 - 38',
      answer: '57',
    });
    const res = await owner.post('/api/review-plans', {
      studentId: student,
      scheduledFor: '2026-03-01',
      missIds: [foreign.body.id],
    });
    expect(res.status).toBe(404);
    expect((await owner.get(`/api/review-plans?studentId=${student}`).expect(200)).body.total).toBe(
      before,
    );
    expect(await statusOf(other)).toBe('logged');
  });

  it('lets a tutor build a plan for a granted child only', async () => {
    await miss(wren, '2026-02-10', '81 - 38', '57');
    const ok = await tutor.post('/api/review-plans', {
      studentId: wren,
      scheduledFor: '2026-02-12',
    });
    expect(ok.status, ok.text).toBe(201);
    await tutor
      .post('/api/review-plans', { studentId: milo, scheduledFor: '2026-02-12' })
      .expect(404);
    await stranger.get(`/api/review-plans/${ok.body.id}`).expect(404);
    const list = await tutor.get('/api/review-plans').expect(200);
    expect(list.body.items.every((p: { studentId: number }) => p.studentId === wren)).toBe(true);
  });
});

describe('exports', () => {
  let plan: ReviewPlanJson;

  beforeAll(async () => {
    const student = await freshStudent('Export child');
    await miss(student, '2026-02-02', '304 - 75', '139', {
      revisit: ['12', '13', '14', '20'],
      explanation: 'I took the one from the 3.',
    });
    await miss(student, '2026-02-03', '6 x 7', '48');
    plan = (
      await owner
        .post('/api/review-plans', { studentId: student, scheduledFor: '2026-02-06' })
        .expect(201)
    ).body;
  });

  it('prints a PDF whose text holds the lessons, facts, problems, answers and the caution', async () => {
    const res = await owner
      .get(`/api/review-plans/${plan.id}/export.pdf`)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toContain(`review-plan-${plan.id}-2026-02-06.pdf`);
    const text = await pdfText(res.body as Buffer);
    expect(text).toContain('Review plan for Export child');
    expect(text).toContain('Revisit lessons 12–14');
    expect(text).toContain('Revisit lesson 20');
    expect(text).toContain('6 × 7');
    expect(text).toContain(plan.factFamilies[0]!.activity.title);
    expect(text).toContain('I took the one from the 3.');
    for (const p of plan.practice[0]!.problems) {
      expect(text).toContain(p.problem);
      expect(text).toContain(`${p.problem} = ${p.answer}`);
    }
    expect(text).toContain('Answers');
    expect(text).toMatch(/aids a parent’s judgement/);
  });

  it('gives a CSV with a row per lesson range, fact family, miss and practice problem', async () => {
    const res = await owner.get(`/api/review-plans/${plan.id}/export.csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0]!)).toEqual([
      'section',
      'item',
      'problem',
      'child_answer',
      'answer',
      'activity',
      'done',
      'miss_ids',
      'line_check',
    ]);
    // Lessons carry their titles from the demo course (seeds/demo-curriculum.json).
    expect(rows.filter((r) => r.section === 'lessons').map((r) => r.item)).toEqual([
      'Revisit lessons 12–14: 12 “Facts: sevens”, 13 “Facts: eights and nines”, 14 “Regrouping across a zero”',
      'Revisit lesson 20 “Division facts”',
    ]);
    expect(rows.find((r) => r.section === 're-work' && r.problem === '304 - 75')).toMatchObject({
      child_answer: '139',
      answer: '229',
    });
    const practice = rows.filter((r) => r.section === 'practice');
    expect(practice.map((r) => r.problem)).toEqual(
      plan.practice[0]!.problems.map((p) => p.problem),
    );
    expect(practice.map((r) => r.answer)).toEqual(plan.practice[0]!.problems.map((p) => p.answer));
  });

  it('e-mails the PDF to chosen members, captured by the fake server', async () => {
    const members = (await owner.get('/api/members').expect(200)).body.items as {
      id: number;
      email: string;
      role: string;
    }[];
    const parent = members.find((m) => m.email === DEMO.parent)!;
    const res = await owner.post(`/api/review-plans/${plan.id}/send`, {
      memberIds: [parent.id],
      message: 'For Thursday.',
    });
    expect(res.status, res.text).toBe(200);
    const mail = await waitForMail(owner, DEMO.parent, /Review plan for Export child/);
    expect(mail.text).toContain('For Thursday.');
    expect(mail.attachments).toEqual([
      expect.objectContaining({
        filename: `review-plan-${plan.id}-2026-02-06.pdf`,
        contentType: 'application/pdf',
      }),
    ]);
    expect(mail.attachments[0]!.size).toBeGreaterThan(10_000);
  });

  it('sends nothing when a recipient is a tutor not given the child, or not a member', async () => {
    const members = (await owner.get('/api/members').expect(200)).body.items as {
      id: number;
      role: string;
      email: string;
    }[];
    const tutorMember = members.find((m) => m.role === 'tutor')!;
    const parent = members.find((m) => m.email === DEMO.parent)!;
    const count = (await outbox(owner)).length;
    const res = await owner.post(`/api/review-plans/${plan.id}/send`, {
      memberIds: [parent.id, tutorMember.id],
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fields)).toEqual(['memberIds.1']);
    await owner.post(`/api/review-plans/${plan.id}/send`, { memberIds: [999_999] }).expect(404);
    await owner.post(`/api/review-plans/${plan.id}/send`, { memberIds: [] }).expect(400);
    await tutor.post(`/api/review-plans/${plan.id}/send`, { memberIds: [parent.id] }).expect(403);
    expect((await outbox(owner)).length).toBe(count);
  });
});

describe('GET /api/students/:id/portfolio.pdf', () => {
  it('gives dated work samples with the no-claim line', async () => {
    const res = await owner
      .get(`/api/students/${wren}/portfolio.pdf`)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    const text = await pdfText(res.body as Buffer);
    expect(text).toContain('Work samples of Wren');
    expect(text).toContain('makes no claim about any jurisdiction’s requirements');
    expect(text).toContain('304 - 75');
  });

  it('keeps to the dates asked and names bad ones', async () => {
    const res = await owner
      .get(`/api/students/${wren}/portfolio.pdf?from=2000-01-01&to=2000-01-31`)
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(await pdfText(res.body as Buffer)).toContain('No work samples in these dates');
    const bad = await owner.get(
      `/api/students/${wren}/portfolio.pdf?from=2026-03-01&to=2026-02-01`,
    );
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields)).toEqual(['to']);
    await tutor.get(`/api/students/${milo}/portfolio.pdf`).expect(404);
  });
});
