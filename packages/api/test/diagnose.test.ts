import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Client, DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

let t: TestApp;
let tutor: Client;

beforeAll(async () => {
  t = await startTestApp();
  tutor = await signedIn(t, DEMO.tutor);
});
afterAll(() => t.close());

describe('POST /api/diagnose', () => {
  it('answers the engine’s diagnosis for the form’s preview', async () => {
    const res = await tutor.post('/api/diagnose', { problem: '81 - 38', answer: '57' }).expect(200);
    // 81 − 38 = 43; writing 57 is SMALLER-FROM-LARGER (Brown & Burton 1978; from memory).
    expect(res.body).toMatchObject({ expected: String(81 - 38), correct: false });
    expect(res.body.rules[0].id).toBe('sub.smaller-from-larger');
    expect(res.body.engineVersion).toEqual(expect.any(String));
    expect(res.body.trace.expected).toBeTypeOf('object');
  });

  it('checks written steps and says a right answer is right', async () => {
    // 34 × 12 = 408 with partial products 68 and 340 (common practice, no source).
    const res = await tutor
      .post('/api/diagnose', {
        problem: '34 x 12',
        answer: '408',
        steps: { partials: ['68', '340'] },
      })
      .expect(200);
    expect(res.body).toMatchObject({ expected: String(34 * 12), correct: true, rules: [] });
  });

  it('draws the written partial products beside the usual ones and marks the first that differs', async () => {
    // 347 × 6 = 2082 and 347 × 20 = 6940; the child wrote 6840 (issue 11 §1).
    const res = await tutor
      .post('/api/diagnose', {
        problem: '347 x 26',
        answer: '8,922',
        steps: { partials: ['2,082', '6840'] },
      })
      .expect(200);
    expect(res.body.rules).toEqual([]);
    expect(res.body.writtenSteps).toMatchObject({
      kind: 'partials',
      firstDiffers: 1,
      steps: [
        { label: 'partial product 1', expected: String(347 * 6), written: '2082', ok: true },
        { label: 'partial product 2', expected: String(347 * 20), written: '6840', ok: false },
      ],
    });
    expect(res.body.writtenSteps.steps[1].finding).toMatchObject({ oneOff: true });
  });

  it.each([
    [{ problem: '304 $ 75', answer: '1' }, 422, 'problem'],
    [{ problem: '304 - 75', answer: 'lots' }, 422, 'answer'],
    [{ problem: '34 x 12', answer: '408', steps: { partials: ['six'] } }, 422, 'steps'],
    [{ problem: '', answer: '1' }, 400, 'problem'],
    [{ problem: '1 + 1' }, 400, 'answer'],
    [{ problem: '1 + 1', answer: '2', steps: [1] }, 400, 'steps'],
    [{ problem: 'x'.repeat(201), answer: '2' }, 400, 'problem'],
    // Issue 11 §3: these used to get past the parser and throw inside the engine.
    [{ problem: 'round 3456 to nearest __proto__', answer: '3500' }, 422, 'problem'],
    [{ problem: 'round 3456 to nearest constructor', answer: '3500' }, 422, 'problem'],
    [{ problem: '34 x 12', answer: '408', steps: { partials: ['68', '340', '0'] } }, 422, 'steps'],
    [{ problem: '45 ÷ 6', answer: '7 rem 3' }, 422, 'answer'],
  ])('refuses %j with %i naming %s', async (body, status, field) => {
    const res = await tutor.post('/api/diagnose', body).expect(status);
    expect(res.body.fields).toHaveProperty(field);
    expect(res.body.message.length).toBeGreaterThan(5);
  });

  // Issue 11 §3: the message names a whole word, quotes an emoji whole, shortens long input.
  it.each([
    [{ problem: '45 ÷ 6', answer: '7 rem 3' }, 'answer', 'the word “rem”'],
    [{ problem: '81 - 38', answer: 'forty-three' }, 'answer', 'the word “forty-three”'],
    [{ problem: '81 👍🏽 38', answer: '43' }, 'problem', '“👍🏽”'],
    [{ problem: `${'7'.repeat(150)} + 1`, answer: '8' }, 'problem', '…”'],
  ])('says what it could not read in %j', async (body, field, words) => {
    const res = await tutor.post('/api/diagnose', body).expect(422);
    expect(res.body.fields[field]).toContain(words);
    expect(res.body.message.length).toBeLessThan(200);
  });
});
