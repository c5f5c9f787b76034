import { readFileSync } from 'node:fs';
import { parse } from 'csv-parse/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type Client, DEMO, signedIn, startTestApp, type TestApp } from './support/test-app.js';

const SAMPLE = readFileSync(new URL('../../../fixtures/keys/sample-key.csv', import.meta.url));
const HEADER = 'number,prompt,answer,skills,revisit,facts';

let t: TestApp;
let owner: Client;
let tutor: Client;
let courseId: number;

beforeAll(async () => {
  t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  tutor = await signedIn(t, DEMO.tutor);
  const course = await owner.post('/api/courses', { name: 'Import course' }).expect(201);
  courseId = course.body.id as number;
  for (const number of [1, 2, 3, 4, 5]) {
    await owner
      .post(`/api/courses/${courseId}/lessons`, { number, title: `Lesson ${number}` })
      .expect(201);
  }
});
afterAll(() => t.close());

function upload(
  client: Client,
  file: Buffer | string,
  fields: Record<string, string> = { title: 'Imported', kind: 'worksheet' },
  name = 'key.csv',
  contentType = 'text/csv',
) {
  const req = client.agent.post('/api/answer-keys/import').set('x-csrf-token', client.token);
  for (const [k, v] of Object.entries(fields)) req.field(k, v);
  return req.attach('file', Buffer.from(file), { filename: name, contentType });
}

async function keyCount(): Promise<number> {
  return (await owner.get('/api/answer-keys').expect(200)).body.total as number;
}

type Item = {
  number: number;
  prompt: string;
  answer: string;
  skills: string[];
  revisit: string[];
  facts: string[];
};
const plain = (items: Item[]) =>
  items.map(({ number, prompt, answer, skills, revisit, facts }) => ({
    number,
    prompt,
    answer,
    skills,
    revisit,
    facts,
  }));

describe('CSV import', () => {
  it('imports the sample key with quoted commas, lists and ranges', async () => {
    const res = await upload(owner, SAMPLE, { title: 'Sample worksheet', kind: 'worksheet' });
    expect(res.status, res.text).toBe(201);
    expect(res.body).toMatchObject({ title: 'Sample worksheet', kind: 'worksheet', itemCount: 12 });
    // What csv-parse (an outside RFC 4180 reader) makes of the same bytes is what we stored.
    const rows = parse(SAMPLE, { columns: true, bom: true }) as Record<string, string>[];
    expect(plain(res.body.items)).toEqual(
      rows.map((r) => ({
        number: Number(r.number),
        prompt: r.prompt,
        answer: r.answer,
        skills: r
          .skills!.split(';')
          .map((s) => s.trim())
          .filter(Boolean),
        revisit: r
          .revisit!.split(';')
          .map((s) => s.trim())
          .filter(Boolean),
        facts: r
          .facts!.split(';')
          .map((s) => s.trim())
          .filter(Boolean),
      })),
    );
    expect(res.body.items[6]).toMatchObject({
      number: 7,
      answer: '1,128',
      revisitLessons: [19],
    });
    expect(res.body.items[11].prompt).toBe(
      'Nell has 3 bags of 8 shells, then finds 5 more. How many shells?',
    );
    expect(res.body.flags).toEqual([]);
  });

  it('reads the same key with a BOM and CRLF line ends', async () => {
    const lf = await upload(owner, SAMPLE).expect(201);
    const crlf = Buffer.concat([
      Buffer.from([0xef, 0xbb, 0xbf]),
      Buffer.from(SAMPLE.toString('utf8').replace(/\n/g, '\r\n')),
    ]);
    const res = await upload(owner, crlf);
    expect(res.status, res.text).toBe(201);
    expect(plain(res.body.items)).toEqual(plain(lf.body.items));
    expect(res.body.items[0].number).toBe(1);
  });

  it('checks the lessons to revisit against the course', async () => {
    const res = await upload(owner, `${HEADER}\n1,58 + 67,125,,3-4,\n2,81 - 38,43,,5,\n`, {
      title: 'With course',
      kind: 'review',
      courseId: String(courseId),
      lessonNumber: '2',
    });
    expect(res.status, res.text).toBe(201);
    expect(res.body).toMatchObject({ courseId, lessonNumber: 2 });
  });

  it('refuses a file with bad rows, listing every one by line and field, importing nothing', async () => {
    const before = await keyCount();
    const file = [
      HEADER,
      '1,58 + 67,125,addition,3,',
      '2,81 - 38',
      '3,304 - 75,,subtraction,5,',
      '',
      '4,1300 - 522,778,,4-2,',
      '5,27 x 4,108,,9,fours',
      'x,365 + 574,939,,,',
      '1,"12 + 5, then 3",20,,,',
      '6,"47 x 24","1,128",,1-2; 4,',
    ].join('\r\n');
    const res = await upload(owner, file, {
      title: 'Bad rows',
      kind: 'worksheet',
      courseId: String(courseId),
    });
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({
      'line 3.columns':
        'has 2 values; the header has 6 (put a cell holding a comma in double quotes)',
      'line 4.answer': 'answer is missing (1 to 80 characters)',
      'line 6.revisit': 'range “4-2” runs backwards; write 2-4',
      'line 7.revisit': 'lesson 9 is not in “Import course”',
      'line 8.number': 'number must be a whole number',
      'line 9.number': 'number 1 is used twice (first at line 2)',
    });
    expect(res.body.message).toMatch(/^6 rows have problems; nothing was imported/);
    expect(await keyCount()).toBe(before);
  });

  it('reads an awkward file exactly as the web’s preview does, refused or imported', async () => {
    // The web's own preview module (a path TypeScript does not follow into the web package).
    const webPreview = new URL(
      '../../web/src/features/answer-keys/utils/read-key-csv.ts',
      import.meta.url,
    ).pathname;
    const { readKeyCsv: preview } = (await import(webPreview)) as {
      readKeyCsv: (text: string) => {
        rows: (Omit<Item, 'number'> & { line: number; number: string })[];
        problems: { line: number; field: string; message: string }[];
      };
    };
    const good = [
      `\uFEFF${HEADER}`,
      '1,"12 + 5, then 3",20,"adding, then more",,',
      '',
      "2,'=3 + 4,7,,2-4,sevens",
      '3,"47 x 24","1,128",multiplication; partial products,5,',
    ];
    const bad = [
      ...good,
      '4,365 + 574,,,,',
      '5,"two',
      'lines",9,,,',
      '6,81 - 38',
      '2,7 + 7,14,,,',
      '7,9 + 9,18,,4-2,',
      '',
    ].join('\r\n');
    const refused = await upload(owner, bad);
    expect(refused.status).toBe(400);
    const seen = preview(bad);
    expect(seen.problems.length).toBeGreaterThanOrEqual(5);
    expect(refused.body.fields).toEqual(
      Object.fromEntries(seen.problems.map((p) => [`line ${p.line}.${p.field}`, p.message])),
    );

    const file = [...good, ''].join('\r\n');
    const imported = await upload(owner, file);
    expect(imported.status, imported.text).toBe(201);
    const read = preview(file);
    expect(read.problems).toEqual([]);
    expect(plain(imported.body.items)).toEqual(
      read.rows.map(({ line: _, number, ...cells }) => ({ number: Number(number), ...cells })),
    );
  });

  it('refuses control characters in a cell by line and field, importing nothing', async () => {
    const before = await keyCount();
    const res = await upload(
      owner,
      `${HEADER}\n1,58 + 67,125,,,\n2,"81\u001b - 38",43,,,\n3,27 x 4,10\u00078,,,\n`,
    );
    expect(res.status, res.text).toBe(400);
    expect(res.body.fields).toMatchObject({
      'line 3.prompt': expect.stringMatching(/control characters/),
      'line 4.answer': expect.stringMatching(/control characters/),
    });
    expect(await keyCount()).toBe(before);
  });

  it('names the line of a quote left open', async () => {
    const res = await upload(owner, `${HEADER}\n1,58 + 67,125,,,\n2,"81 - 38,43,,,\n`);
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({ 'line 3.file': 'a double quote is opened and never closed' });
  });

  it('refuses a header it does not know and a file without items', async () => {
    const header = await upload(owner, 'num,question,answer\n1,58 + 67,125\n');
    expect(res400(header)).toEqual({
      'line 1.header':
        'unknown column “num”, “question”; missing column number, prompt (the header is number,prompt,answer,skills,revisit,facts)',
    });
    expect(res400(await upload(owner, `${HEADER}\n\n`))).toEqual({
      file: 'file has a header but no items',
    });
    expect(res400(await upload(owner, ''))).toEqual({ 'line 1.file': 'the file is empty' });
  });

  it('accepts columns in another order and leaves optional ones out', async () => {
    const res = await upload(owner, 'Answer,Number,Prompt\n125,1,58 + 67\n');
    expect(res.status, res.text).toBe(201);
    expect(plain(res.body.items)).toEqual([
      { number: 1, prompt: '58 + 67', answer: '125', skills: [], revisit: [], facts: [] },
    ]);
  });

  it('answers 413 past 2 MiB, 415 for what is not UTF-8 CSV, 400 without a file or title', async () => {
    const before = await keyCount();
    const big = `${HEADER}\n` + `1,58 + 67,125,,,${' '.repeat(100)}\n`.repeat(22_000);
    expect(Buffer.byteLength(big)).toBeGreaterThan(2 * 1024 * 1024);
    const large = await upload(owner, big);
    expect(large.status).toBe(413);
    expect(large.body.fields).toEqual({ file: 'is over 2 MiB' });
    const png = await upload(
      owner,
      readFileSync(new URL('../../../fixtures/photos/sheet.png', import.meta.url)),
      undefined,
      'sheet.png',
      'image/png',
    );
    expect(png.status).toBe(415);
    const latin1 = await upload(owner, Buffer.from(`${HEADER}\n1,caf\xe9,1,,,\n`, 'latin1'));
    expect(latin1.status).toBe(415);
    expect(latin1.body.message).toContain('UTF-8');
    const noFile = await owner.agent
      .post('/api/answer-keys/import')
      .set('x-csrf-token', owner.token)
      .field('title', 'x')
      .field('kind', 'review');
    expect(noFile.status).toBe(400);
    expect(noFile.body.fields).toEqual({ file: 'file is missing: attach the CSV as “file”' });
    const noTitle = await upload(owner, SAMPLE, { kind: 'review' });
    expect(noTitle.status).toBe(400);
    expect(noTitle.body.fields).toHaveProperty('title');
    const json = await owner.post('/api/answer-keys/import', { title: 'x', kind: 'review' });
    expect(json.status).toBe(415);
    expect(await keyCount()).toBe(before);
  });

  it('lets only owners and parents import', async () => {
    expect((await upload(tutor, SAMPLE)).status).toBe(403);
  });
});

describe('CSV export', () => {
  it('writes the documented format that imports back to the same key', async () => {
    const original = await upload(owner, SAMPLE, { title: 'Round trip', kind: 'review' }).expect(
      201,
    );
    const res = await owner.get(`/api/answer-keys/${original.body.id}/export.csv`).expect(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toBe('attachment; filename="round-trip.csv"');
    const text = res.text;
    expect(text.startsWith(`\ufeff${HEADER}\r\n`)).toBe(true);
    expect(text).toContain('\r\n5,1300 - 522,778,subtraction; regrouping across zeros,14-15,\r\n');
    expect(text).toContain('\r\n7,47 x 24,"1,128",multiplication; partial products,19,\r\n');
    const again = await upload(owner, text, { title: 'Round trip', kind: 'review' });
    expect(again.status, again.text).toBe(201);
    expect(plain(again.body.items)).toEqual(plain(original.body.items));
  });

  it('guards cells a spreadsheet would run as formulas, and reads them back unchanged', async () => {
    const key = await owner
      .post('/api/answer-keys', {
        title: 'Odd cells',
        kind: 'worksheet',
        items: [
          { number: 1, prompt: '=1+2', answer: '@3', skills: ['quotes "inside"'] },
          { number: 2, prompt: '+5 more', answer: '-', facts: ['a;b'.replace(';', ' ')] },
        ],
      })
      .expect(201);
    const csv = await owner.get(`/api/answer-keys/${key.body.id}/export.csv`).expect(200);
    expect(csv.text).toContain(`\r\n1,'=1+2,'@3,"quotes ""inside""",,\r\n`);
    const again = await upload(owner, csv.text).expect(201);
    expect(plain(again.body.items)).toEqual(plain(key.body.items));
  });
});

function res400(res: { status: number; body: { fields?: Record<string, string> } }) {
  expect(res.status).toBe(400);
  return res.body.fields;
}
