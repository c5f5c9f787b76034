import { extractText, getDocumentProxy } from 'unpdf';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  type Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';

let t: TestApp;
let owner: Client;
let tutor: Client;
let stranger: Client;
let wren: number;
let milo: number;

interface CheckUpJson {
  id: number;
  studentId: number;
  answerKeyId: number;
  sittingId: number | null;
  hypotheses: { id: string; name: string }[];
  problems: { problem: string; answers: Record<string, string> }[];
  status: string;
  reading: {
    verdict: string;
    confirmed: string | null;
    ruledOut: string[];
    open: string[];
    sentence: string;
    answers: (string | null)[];
  } | null;
}

const binary = (res: import('superagent').Response, cb: (e: Error | null, b: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function pdfText(client: Client, url: string): Promise<string> {
  const res = await client.get(url).buffer(true).parse(binary).expect(200);
  expect(res.headers['content-type']).toBe('application/pdf');
  const doc = await getDocumentProxy(new Uint8Array(res.body as Buffer));
  return (await extractText(doc, { mergePages: true })).text;
}

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  tutor = await signedIn(t, DEMO.tutor);
  stranger = await registered(t, 'check-up-stranger@example.test', 'Elsewhere');
  const students = (await owner.get('/api/students').expect(200)).body.items as {
    id: number;
    name: string;
  }[];
  wren = students.find((s) => s.name === 'Wren')!.id;
  milo = students.find((s) => s.name === 'Milo')!.id;
});
afterAll(() => t.close());

async function makeCheckUp(client: Client, body: object): Promise<CheckUpJson> {
  const res = await client.post('/api/check-ups', body);
  expect(res.status, res.text).toBe(201);
  return res.body as CheckUpJson;
}

const RULES = ['sub.borrow-across-zero', 'sub.borrow-from-zero'];

describe('making a check-up', () => {
  it('plans 4–6 problems that tell the rules and the usual working apart, kept as a key', async () => {
    const checkUp = await makeCheckUp(owner, { studentId: wren, ruleIds: RULES, digits: 4 });
    expect(checkUp.status).toBe('not taken');
    expect(checkUp.hypotheses.map((h) => h.id)).toEqual(['correct', ...RULES]);
    expect(checkUp.hypotheses[1]!.name).toBe('Zeros skipped when regrouping');
    expect(checkUp.problems.length).toBeGreaterThanOrEqual(4);
    expect(checkUp.problems.length).toBeLessThanOrEqual(6);
    const key = (await owner.get(`/api/answer-keys/${checkUp.answerKeyId}`).expect(200)).body as {
      kind: string;
      items: { prompt: string; answer: string }[];
    };
    expect(key.kind).toBe('check-up');
    expect(key.items.map((i) => i.prompt)).toEqual(checkUp.problems.map((p) => p.problem));
    // The key's answers are the right answers, by plain arithmetic (common practice, no source).
    for (const item of key.items) {
      const [top, bottom] = item.prompt.split(' − ').map((n) => BigInt(n));
      expect(item.answer).toBe(String(top! - bottom!));
    }
  });

  it('gives a second check-up on the same rules new problems', async () => {
    const a = await makeCheckUp(owner, { studentId: milo, ruleIds: ['add.no-carry'] });
    const b = await makeCheckUp(owner, { studentId: milo, ruleIds: ['add.no-carry'] });
    expect(a.problems.map((p) => p.problem)).not.toEqual(b.problems.map((p) => p.problem));
  });

  it('refuses rules it cannot plan, naming the field', async () => {
    const unknown = await owner.post('/api/check-ups', { studentId: wren, ruleIds: ['sub.nope'] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.fields).toHaveProperty('ruleIds');
    const mixed = await owner.post('/api/check-ups', {
      studentId: wren,
      ruleIds: ['add.no-carry', 'sub.borrow-across-zero'],
    });
    expect(mixed.status).toBe(400);
    expect(mixed.body.fields.ruleIds).toContain('one operation');
    const none = await owner.post('/api/check-ups', { studentId: wren, ruleIds: [] });
    expect(none.status).toBe(400);
    const digits = await owner.post('/api/check-ups', {
      studentId: wren,
      ruleIds: RULES,
      digits: 40,
    });
    expect(digits.status).toBe(400);
    expect(digits.body.fields).toHaveProperty('digits');
  });

  it('keeps each household’s check-ups to itself, and a tutor to the children given', async () => {
    const checkUp = await makeCheckUp(owner, { studentId: milo, ruleIds: RULES });
    await stranger.get(`/api/check-ups/${checkUp.id}`).expect(404);
    await stranger.post('/api/check-ups', { studentId: wren, ruleIds: RULES }).expect(404);
    const seen = (await tutor.get('/api/students').expect(200)).body.items as { id: number }[];
    const given = seen[0]!.id;
    const other = given === wren ? milo : wren;
    await tutor.post('/api/check-ups', { studentId: other, ruleIds: RULES }).expect(404);
    const mine = await makeCheckUp(tutor, { studentId: given, ruleIds: RULES });
    await tutor.get(`/api/check-ups/${mine.id}`).expect(200);
    const hidden = await makeCheckUp(owner, { studentId: other, ruleIds: RULES });
    await tutor.get(`/api/check-ups/${hidden.id}`).expect(404);
    const list = (await tutor.get('/api/check-ups').expect(200)).body.items as CheckUpJson[];
    expect(list.every((c) => c.studentId === given)).toBe(true);
    // Entering answers makes a sitting: parents only.
    await tutor
      .post(`/api/check-ups/${mine.id}/answers`, {
        startedAt: '2026-11-20T09:30',
        answers: mine.problems.map((p) => p.answers.correct),
      })
      .expect(403);
  });
});

describe('taking a check-up', () => {
  it('stores the answers as a sitting, makes misses of the wrong ones, and confirms the rule', async () => {
    const checkUp = await makeCheckUp(owner, { studentId: wren, ruleIds: RULES, digits: 4 });
    const answers = checkUp.problems.map((p) => p.answers['sub.borrow-across-zero']!);
    const res = await owner.post(`/api/check-ups/${checkUp.id}/answers`, {
      startedAt: '2026-11-20T16:45',
      minutes: 12,
      conditions: { rested: true, afterMeal: false, note: 'calm afternoon' },
      answers,
    });
    expect(res.status, res.text).toBe(201);
    const taken = res.body as CheckUpJson & { misses: { createdMissIds: number[] } };
    expect(taken.status).toBe('confirmed');
    expect(taken.reading!.confirmed).toBe('sub.borrow-across-zero');
    expect(taken.reading!.ruledOut).toContain('correct');
    expect(taken.reading!.sentence).toContain('Zeros skipped when regrouping');
    expect(taken.reading!.answers).toEqual(answers);
    const wrong = checkUp.problems.filter(
      (p) => p.answers['sub.borrow-across-zero'] !== p.answers.correct,
    );
    expect(taken.misses.createdMissIds).toHaveLength(wrong.length);

    const sitting = (await owner.get(`/api/sittings/${taken.sittingId}`).expect(200)).body as {
      timeOfDay: string;
      rested: boolean | null;
      correct: number;
      marked: number;
    };
    expect(sitting.timeOfDay).not.toBe('');
    const miss = (await owner.get(`/api/misses/${taken.misses.createdMissIds[0]}`).expect(200))
      .body as { diagnosis: { rules: { id: string }[] } };
    expect(miss.diagnosis.rules[0]!.id).toBe('sub.borrow-across-zero');

    // The patterns card of those rules now says what the check-up found.
    const patterns = (await owner.get(`/api/patterns?studentId=${wren}`).expect(200)).body as {
      difficulties: {
        ruleIds: string[];
        checkUp: { id: number; status: string; fits: string | null } | null;
      }[];
    };
    const card = patterns.difficulties.find((d) => d.ruleIds.includes('sub.borrow-across-zero'));
    expect(card?.checkUp).toMatchObject({
      id: checkUp.id,
      status: 'confirmed',
      fits: 'sub.borrow-across-zero',
    });

    // Taken once: a second set of answers is refused, and nothing changes.
    const again = await owner.post(`/api/check-ups/${checkUp.id}/answers`, {
      startedAt: '2026-11-21T16:45',
      answers,
    });
    expect(again.status).toBe(400);
    expect(again.body.fields).toHaveProperty('answers');
  });

  it('reads right answers as the usual working, and the right items count against the rules', async () => {
    const checkUp = await makeCheckUp(owner, { studentId: wren, ruleIds: RULES, digits: 3 });
    const answers = checkUp.problems.map((p) => p.answers.correct!);
    answers[0] = `${answers[0]}1`; // one slip no working writes
    const res = await owner
      .post(`/api/check-ups/${checkUp.id}/answers`, { startedAt: '2026-11-22T09:00', answers })
      .expect(201);
    const taken = res.body as CheckUpJson;
    expect(taken.reading!.confirmed).toBe('correct');
    expect(taken.reading!.sentence).toContain('one-off slips');
    // Wren's demo misses make sub.borrow-across-zero a finding; right answers on problems where
    // it writes something else now stand against it.
    const patterns = (
      await owner.get(`/api/patterns?studentId=${wren}&from=2026-01-01&to=2026-12-31`).expect(200)
    ).body as {
      findings: { rules: { ruleId: string; contradictions: { problem: string }[] }[] };
    };
    const across = patterns.findings.rules.find((r) => r.ruleId === 'sub.borrow-across-zero');
    const against = new Set(
      checkUp.problems
        .slice(1)
        .filter((p) => p.answers['sub.borrow-across-zero'] !== p.answers.correct)
        .map((p) => p.problem),
    );
    expect(against.size).toBeGreaterThan(0);
    expect(across!.contradictions.some((c) => against.has(c.problem))).toBe(true);
  });

  it('takes a check-up whose answers are sent five times at once (a double tap, a retry) once, answering each', async () => {
    const checkUp = await makeCheckUp(owner, { studentId: milo, ruleIds: RULES, digits: 4 });
    const answers = checkUp.problems.map((p) => p.answers['sub.borrow-across-zero']!);
    const wrong = checkUp.problems.filter(
      (p) => p.answers['sub.borrow-across-zero'] !== p.answers.correct,
    ).length;
    expect(wrong).toBeGreaterThan(0);
    const body = {
      startedAt: '2026-11-23T16:45',
      minutes: 10,
      conditions: { rested: true, note: 'after the walk' },
      answers,
    };
    const sittingsOfMilo = async () =>
      (await owner.get(`/api/sittings?studentId=${milo}`).expect(200)).body.total as number;
    const missesOfMilo = async () =>
      (await owner.get(`/api/misses?studentId=${milo}&pageSize=100`).expect(200)).body.items as {
        id: number;
        sittingId: number | null;
      }[];
    const sittingsBefore = await sittingsOfMilo();
    const missesBefore = (await missesOfMilo()).length;
    const send = (b: object) => owner.post(`/api/check-ups/${checkUp.id}/answers`, b);

    // Each read the check-up not taken yet, and each made a sitting and its misses.
    const sends = await Promise.all(Array.from({ length: 5 }, () => send(body)));
    expect(sends.map((r) => `${r.status} ${r.status === 201 ? '' : r.text}`)).toEqual(
      Array(5).fill('201 '),
    );
    const sittingIds = new Set(sends.map((r) => r.body.sittingId as number));
    expect(sittingIds.size).toBe(1);
    const [sittingId] = [...sittingIds];
    expect(sends.map((r) => (r.body as CheckUpJson).status)).toEqual(Array(5).fill('confirmed'));
    const created = sends.flatMap((r) => r.body.misses.createdMissIds as number[]);
    expect(created).toHaveLength(wrong);
    expect(await sittingsOfMilo()).toBe(sittingsBefore + 1);
    const misses = await missesOfMilo();
    expect(misses).toHaveLength(missesBefore + wrong);
    expect(
      misses
        .filter((m) => m.sittingId === sittingId)
        .map((m) => m.id)
        .sort(),
    ).toEqual([...created].sort());

    // A retry later is answered the same way; other answers are still refused, changing nothing.
    const retry = await send(body);
    expect(retry.status, retry.text).toBe(201);
    expect(retry.body).toMatchObject({ sittingId, status: 'confirmed' });
    expect(retry.body.misses.createdMissIds).toEqual([]);
    const other = await send({ ...body, answers: checkUp.problems.map((p) => p.answers.correct) });
    expect(other.status).toBe(400);
    expect(other.body.fields.answers).toContain('already taken');
    expect(await sittingsOfMilo()).toBe(sittingsBefore + 1);
    expect(await missesOfMilo()).toHaveLength(missesBefore + wrong);
  });

  it('refuses answers that do not fit the sheet, leaving no sitting behind', async () => {
    const checkUp = await makeCheckUp(owner, { studentId: wren, ruleIds: RULES });
    const before = (await owner.get(`/api/sittings?studentId=${wren}`).expect(200)).body.total;
    const short = await owner.post(`/api/check-ups/${checkUp.id}/answers`, {
      startedAt: '2026-11-20T09:30',
      answers: ['1'],
    });
    expect(short.status).toBe(400);
    expect(short.body.fields).toHaveProperty('answers');
    const blank = await owner.post(`/api/check-ups/${checkUp.id}/answers`, {
      startedAt: '2026-11-20T09:30',
      answers: checkUp.problems.map(() => null),
    });
    expect(blank.status).toBe(400);
    const badTime = await owner.post(`/api/check-ups/${checkUp.id}/answers`, {
      startedAt: 'yesterday',
      answers: checkUp.problems.map((p) => p.answers.correct),
    });
    expect(badTime.status).toBe(400);
    expect(badTime.body.fields).toHaveProperty('startedAt');
    const after = (await owner.get(`/api/sittings?studentId=${wren}`).expect(200)).body.total;
    expect(after).toBe(before);
    expect((await owner.get(`/api/check-ups/${checkUp.id}`).expect(200)).body.status).toBe(
      'not taken',
    );
  });
});

describe('the printed sheets', () => {
  it('give the child the problems without answers, and the parent every answer’s meaning', async () => {
    const checkUp = await makeCheckUp(owner, { studentId: wren, ruleIds: RULES, digits: 4 });
    const child = await pdfText(owner, `/api/check-ups/${checkUp.id}/sheet.pdf`);
    expect(child).toContain('Check-up for Wren');
    for (const p of checkUp.problems) {
      expect(child).toContain(p.problem.split(' ')[0]!);
      expect(child).not.toContain(p.answers.correct!);
    }
    const parent = await pdfText(owner, `/api/check-ups/${checkUp.id}/answers.pdf`);
    expect(parent).toContain('Zeros skipped when regrouping');
    expect(parent).toContain('right: the usual working');
    for (const p of checkUp.problems) expect(parent).toContain(p.answers.correct!);
    await stranger.get(`/api/check-ups/${checkUp.id}/answers.pdf`).expect(404);
  });
});
