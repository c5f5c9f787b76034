import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signedIn, startTestApp, type Client, type TestApp } from './support/test-app.js';

// Issue 11 §6–§7: patterns a tutor reads at a glance, in plain words, on the demo household.

let t: TestApp;
let tutor: Client;
let owner: Client;
let wren: number;

type Card = {
  key: string;
  title: string;
  status: string;
  ruleIds: string[];
  skills: string[];
  sentence: string;
  evidence: { problem: string; answer: string; occurredOn: string }[];
};

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  tutor = await signedIn(t, DEMO.tutor);
  const students = (await tutor.get('/api/students').expect(200)).body.items as {
    id: number;
    name: string;
  }[];
  wren = students.find((s) => s.name === 'Wren')!.id;
});
afterAll(() => t.close());

describe('GET /api/patterns difficulties', () => {
  it('gives one card per difficulty: the zero-regrouping rules, their skill and family in one', async () => {
    const p = (await tutor.get(`/api/patterns?studentId=${wren}`).expect(200)).body;
    const cards = p.difficulties as Card[];
    const ruleOwners = cards.flatMap((c) => c.ruleIds);
    expect(new Set(ruleOwners).size).toBe(ruleOwners.length);
    const zero = cards.filter((c) =>
      c.ruleIds.some((id) => ['sub.borrow-across-zero', 'sub.borrow-from-zero'].includes(id)),
    );
    expect(zero).toHaveLength(1);
    expect(zero[0]!.title).toBe('Regrouping across zeros');
    expect(zero[0]!.skills).toContain('regrouping across zeros');
    expect(cards.map((c) => c.key)).not.toContain('skill:regrouping across zeros');
    // Evidence is the problems themselves, latest first.
    const days = zero[0]!.evidence.map((e) => e.occurredOn);
    expect([...days].sort().reverse()).toEqual(days);
    expect(zero[0]!.evidence[0]).toEqual(
      expect.objectContaining({ problem: expect.any(String), answer: expect.any(String) }),
    );
  });

  it('calls a card a finding only when one of its rules meets the page’s definition', async () => {
    const p = (await tutor.get(`/api/patterns?studentId=${wren}`).expect(200)).body;
    for (const c of p.difficulties as Card[]) {
      const rules = (
        p.findings.rules as { ruleId: string; explains: number; contradictions: unknown[] }[]
      ).filter((r) => c.ruleIds.includes(r.ruleId));
      const meets = rules.some((r) => r.explains >= 2 && r.contradictions.length === 0);
      expect(c.status === 'finding', c.key).toBe(meets);
      if (c.status !== 'finding') expect(c.sentence).not.toMatch(/^Finding/);
    }
  });

  it('names skills in the key’s own words and rules uniquely', async () => {
    const p = (await owner.get(`/api/patterns?studentId=${wren}`).expect(200)).body;
    for (const s of p.skills as { skill: string }[]) expect(s.skill).not.toMatch(/[.]|-\w/);
    const titles = (p.rules as { title: string }[]).map((r) => r.title);
    expect(new Set(titles).size).toBe(titles.length);
    // The notebook filters by the same words the page shows.
    const skill = (p.skills as { skill: string }[])[0]!.skill;
    const list = await owner
      .get(`/api/misses?studentId=${wren}&skill=${encodeURIComponent(skill)}`)
      .expect(200);
    expect(list.body.total).toBeGreaterThan(0);
  });

  it('speaks to whoever reads it, tutor or parent', async () => {
    const p = (await tutor.get(`/api/patterns?studentId=${wren}`).expect(200)).body;
    expect(p.caution).not.toMatch(/your child/i);
  });
});
