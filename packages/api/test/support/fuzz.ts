import { readdirSync } from 'node:fs';
import path from 'node:path';
import fc from 'fast-check';
import sqlite3 from 'sqlite3';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listApiRoutes } from './routes.js';
import { Client, DEMO, signedIn, startTestApp, type TestApp } from './test-app.js';

// Generated hostile input for every write route: wrong types, huge strings, unicode,
// nested objects, prototype-pollution keys, extreme numbers, missing fields, bad multipart.
// Asserts: never a 5xx, a named field on every 400, and SQLite's data_version unchanged by
// every refusal.
const RUNS = Number(process.env.FUZZ_RUNS ?? 1000);

/** Routes that would end the test's own session; covered by the auth tests instead. */
const SKIPPED = new Set(['POST /api/auth/logout']);
/** Public routes that sign in or act without a session: fuzzed from a signed-out client. */
const PUBLIC = /^POST \/api\/(auth|invitations\/:token)/;
const MULTIPART = new Set([
  'POST /api/misses',
  'POST /api/misses/:id/photos',
  'POST /api/answer-keys/import',
]);

/** Which table an `:id` in a route refers to, so the fuzzer reaches the body's validation. */
const ID_TABLES: [RegExp, string][] = [
  [/^\/api\/students\//, 'students'],
  [/^\/api\/misses\//, 'misses'],
  [/^\/api\/photos\//, 'photos'],
  [/^\/api\/answer-keys\//, 'answer_keys'],
  [/^\/api\/courses\//, 'courses'],
  [/^\/api\/lessons\//, 'lessons'],
  [/^\/api\/sittings\//, 'sittings'],
  [/^\/api\/members\//, 'memberships'],
  [/^\/api\/invitations\//, 'invitations'],
  [/^\/api\/review-plans\//, 'review_plans'],
];

const hostileValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.string({ maxLength: 30 }),
  fc.string({ unit: 'grapheme', maxLength: 30 }),
  fc.constantFrom('', ' ', '\u0000', '😀'.repeat(300), 'x'.repeat(20_000), '<script>', '../../etc'),
  // Control characters (NUL, bell, escape, CR, C1) inside otherwise fine text.
  fc.constantFrom('a\u0000b', 'bell\u0007', '\u001b[31mred', 'cr\rhere', 'c1\u0085', 'two\nlines'),
  fc.integer(),
  fc.constantFrom(-1, 0, 1e308, -1e308, Number.MAX_SAFE_INTEGER, 2 ** 63, 0.5),
  fc.boolean(),
  fc.constant(null),
  fc.array(fc.jsonValue({ maxDepth: 1 }), { maxLength: 4 }),
  fc.dictionary(fc.string({ maxLength: 8 }), fc.jsonValue({ maxDepth: 1 }), { maxKeys: 3 }),
  fc.constantFrom('2026-02-30', '2026-13-01', '9999-99-99T99:99', 'NaN', 'true', '1e999'),
);

const hostileText: fc.Arbitrary<string> = fc.oneof(
  fc.string({ maxLength: 30 }),
  fc.string({ unit: 'grapheme', maxLength: 30 }),
  fc.string({ unit: 'binary', maxLength: 12 }),
  fc.constantFrom(...['0x13', '1e1', '19.0', '-1', '1e999', 'NaN', '2026-02-30', '\u0000']),
);

const POLLUTION = ['__proto__', 'constructor', 'prototype', 'isAdmin', 'householdId', 'role'];

/** `{"field":[[[…]]]}` or `{"field":{"a":{"a":…}}}`, `levels` deep. */
function nested(field: string, levels: number, kind: 'array' | 'object'): string {
  const [open, close] = kind === 'array' ? ['[', ']'] : ['{"a":', '}'];
  return `{${JSON.stringify(field)}:${open.repeat(levels)}${kind === 'array' ? '' : '1'}${close.repeat(levels)}}`;
}

/** Ids that are not plain decimal digits, each once read by a lenient parser as 19 or 10. */
export const ODD_IDS = ['0x13', '1e1', '19.0', '+19', ' 19', '19 ', '0b10011', '019.', '１９'];

/** A JSON text: known fields with hostile values, unknown or polluting keys, or any JSON at all. */
function bodyArbitrary(fields: string[]): fc.Arbitrary<string> {
  const keys = fields.length > 0 ? fields : ['name'];
  const shaped = fc
    .uniqueArray(fc.constantFrom(...keys, ...POLLUTION), { maxLength: keys.length + 2 })
    .chain((picked) =>
      fc.tuple(
        fc.constant(picked),
        fc.array(hostileValue, { minLength: picked.length, maxLength: picked.length }),
      ),
    )
    .map(
      ([picked, values]) =>
        // Written by hand so "__proto__" stays an own key in the text, as an attacker sends it.
        `{${picked.map((k, i) => `${JSON.stringify(k)}:${JSON.stringify(values[i]) ?? 'null'}`).join(',')}}`,
    );
  return fc.oneof(
    { weight: 6, arbitrary: shaped },
    { weight: 2, arbitrary: fc.jsonValue({ maxDepth: 3 }).map((v) => JSON.stringify(v)) },
    {
      weight: 1,
      arbitrary: fc
        .tuple(
          fc.constantFrom(...keys),
          fc.integer({ min: 30, max: 3000 }),
          fc.constantFrom('array' as const, 'object' as const),
        )
        .map(([field, levels, kind]) => nested(field, levels, kind)),
    },
    {
      weight: 1,
      arbitrary: fc.constantFrom(
        '{"__proto__":{"isAdmin":true}}',
        '{"constructor":{"prototype":{"x":1}}}',
        '[]',
        '"text"',
        '{}',
        'null',
      ),
    },
  );
}

function multipartArbitrary(fields: string[]) {
  return fc.record({
    fields: fc.array(
      fc.tuple(fc.constantFrom(...fields, ...POLLUTION, 'photos'), fc.string({ maxLength: 40 })),
      { maxLength: 8 },
    ),
    files: fc.array(
      fc.record({
        field: fc.constantFrom('photos', 'file', 'other', '__proto__'),
        name: fc.constantFrom(
          'a.jpg',
          'b.png',
          '../../x.webp',
          'key.csv',
          'no-extension',
          '😀.heic',
        ),
        bytes: fc.oneof(
          fc.uint8Array({ maxLength: 512 }),
          fc.constant(new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 0x10])),
          fc.constant(new TextEncoder().encode('number,prompt,answer\n1,"2 + 2",4\n')),
        ),
      }),
      { maxLength: 6 },
    ),
  });
}

/**
 * Fuzzes one share of the app's write routes (`part` of `of`, every `of`-th route), each on
 * its own app and DATA_DIR, so several test files can share the work across workers.
 */
export function fuzzWriteRoutes({ part, of }: { part: number; of: number }): void {
  let t: TestApp;
  let owner: Client;
  let anon: Client;
  let watcher: sqlite3.Database;
  let schemas: Record<string, { properties?: Record<string, unknown> }>;
  let doc: {
    paths: Record<
      string,
      Record<
        string,
        {
          requestBody?: { content: Record<string, { schema?: { $ref?: string } }> };
          parameters?: { name: string; in: string }[];
        }
      >
    >;
  };

  function one<T>(sql: string): Promise<T | undefined> {
    return new Promise((resolve, reject) =>
      watcher.get<T>(sql, (err, row) => (err ? reject(err) : resolve(row))),
    );
  }

  /** Changes whenever any other connection commits to the database file. */
  async function dataVersion(): Promise<number> {
    return (await one<{ data_version: number }>('PRAGMA data_version'))!.data_version;
  }

  function photoFiles(): number {
    try {
      return readdirSync(path.join(t.dataDir, 'photos')).length;
    } catch {
      return 0;
    }
  }

  function fieldsOf(route: string): string[] {
    const [method, url] = route.split(' ') as [string, string];
    const op = doc.paths[url.replace(/:(\w+)/g, '{$1}')]?.[method.toLowerCase()];
    const content = op?.requestBody?.content ?? {};
    const ref = Object.values(content)[0]?.schema?.$ref;
    const name = ref?.split('/').at(-1);
    return Object.keys((name && schemas[name]?.properties) ?? {});
  }

  async function resolvePath(route: string): Promise<string> {
    const url = route.split(' ')[1]!;
    const table = ID_TABLES.find(([re]) => re.test(url))?.[1];
    let id = '1';
    if (table) {
      const row = await one<{ id: number }>(`SELECT id FROM ${table} ORDER BY id LIMIT 1`).catch(
        () => undefined,
      );
      id = String(row?.id ?? 1);
    }
    return url.replace(':token', 'not-a-real-token').replace(/:(\w+)/g, id);
  }

  beforeAll(async () => {
    t = await startTestApp({ SIGN_IN_LIMIT_PER_MINUTE: '1000000' });
    owner = await signedIn(t, DEMO.owner);
    anon = new Client(t.http());
    await anon.refreshToken();
    const json = await t.http().get('/api/docs-json').expect(200);
    doc = json.body;
    schemas = json.body.components?.schemas ?? {};
    watcher = new sqlite3.Database(path.join(t.dataDir, 'workback.sqlite'), sqlite3.OPEN_READONLY);
  }, 120_000);
  afterAll(async () => {
    if (watcher) await new Promise((r) => watcher.close(r));
    await t?.close();
  });

  /** The database's version after the last request; a refusal must leave it as it was. */
  let version = 0;

  /** Checks a refusal's shape and that the database did not change; true when it was refused. */
  async function expectUnchangedIfRefused(
    route: string,
    res: { status: number; body: Record<string, unknown>; text: string },
    sent = '',
  ): Promise<boolean> {
    const refused = checkRefusal(route, res);
    const now = await dataVersion();
    if (refused) expect(now, `${route} with ${sent.slice(0, 200)}`).toBe(version);
    version = now;
    return refused;
  }

  function checkRefusal(
    route: string,
    res: { status: number; body: Record<string, unknown>; text: string },
  ) {
    expect(res.status, `${route} answered ${res.status}: ${res.text.slice(0, 300)}`).toBeLessThan(
      500,
    );
    if (res.status < 400) return false;
    expect(res.body.statusCode, route).toBe(res.status);
    expect(typeof res.body.message === 'string' && res.body.message.length > 0, route).toBe(true);
    if (res.status === 400) {
      const fields = res.body.fields as Record<string, string> | undefined;
      expect(
        fields && Object.keys(fields).length > 0,
        `${route}: 400 without a field: ${res.text.slice(0, 300)}`,
      ).toBe(true);
    }
    return true;
  }

  describe(`fuzzing write routes, part ${part + 1} of ${of}`, () => {
    let all: string[] = [];
    let routes: string[] = [];
    beforeAll(() => {
      all = listApiRoutes(t.app).filter(
        (r) => /^(POST|PUT|PATCH|DELETE) /.test(r) && !SKIPPED.has(r),
      );
      // Deletes go last so the rows the other routes need stay in place until then.
      routes = [...all]
        .sort((a, b) => Number(a.startsWith('DELETE')) - Number(b.startsWith('DELETE')))
        .filter((_, i) => i % of === part);
    });

    it('covers a real set of routes', () => {
      expect(all.length).toBeGreaterThan(20);
      expect(routes.length).toBeGreaterThanOrEqual(Math.floor(all.length / of));
    });

    it('never answers 5xx, names the field of every 400, and changes nothing when it refuses', async () => {
      for (const route of routes) {
        const method = route.split(' ')[0]!.toLowerCase() as 'post' | 'put' | 'patch' | 'delete';
        const client = PUBLIC.test(route) ? anon : owner;
        const fields = fieldsOf(route);
        const target = await resolvePath(route);
        version = await dataVersion();

        if (method === 'delete' && fields.length === 0) {
          // A body means nothing here: fuzz the id in the path instead, never a real small id.
          await fc.assert(
            fc.asyncProperty(
              fc
                .string({ minLength: 1, maxLength: 40 })
                .filter((s) => !/^\s*\+?0*\d{1,6}\s*$/.test(s)),
              async (raw) => {
                const url = target.replace(/\/[^/]+$/, `/${encodeURIComponent(raw)}`);
                const res = await client.send('delete', url);
                await expectUnchangedIfRefused(route, res);
              },
            ),
            { numRuns: RUNS },
          );
          continue;
        }

        if (MULTIPART.has(route)) {
          await fc.assert(
            fc.asyncProperty(multipartArbitrary(fields), async ({ fields: parts, files }) => {
              const filesBefore = photoFiles();
              let req = client.agent[method](target).set('x-csrf-token', client.token);
              for (const [k, v] of parts) req = req.field(k, v);
              for (const f of files) req = req.attach(f.field, Buffer.from(f.bytes), f.name);
              const res = await req;
              if (await expectUnchangedIfRefused(route, res)) {
                expect(photoFiles(), `${route} left files behind`).toBe(filesBefore);
              }
            }),
            { numRuns: RUNS },
          );
          continue;
        }

        // Every field holding a NUL byte, and a body nested 3,000 deep: refused, never stored.
        for (const field of fields) {
          for (const text of [
            `{${JSON.stringify(field)}:"a\\u0000b"}`,
            nested(field, 3000, 'array'),
            nested(field, 40, 'object'),
          ]) {
            const res = await client.agent[method](target)
              .set('x-csrf-token', client.token)
              .set('Content-Type', 'application/json')
              .send(text);
            expect(
              res.status,
              `${route} with ${text.slice(0, 60)}: ${res.text}`,
            ).toBeGreaterThanOrEqual(400);
            await expectUnchangedIfRefused(route, res, text);
          }
        }

        await fc.assert(
          fc.asyncProperty(bodyArbitrary(fields), async (text) => {
            const res = await client.agent[method](target)
              .set('x-csrf-token', client.token)
              .set('Content-Type', 'application/json')
              .send(text);
            await expectUnchangedIfRefused(route, res, text);
          }),
          { numRuns: RUNS },
        );
      }
      // Pollution never reached the prototype of plain objects.
      expect(({} as Record<string, unknown>).isAdmin).toBeUndefined();
    }, 1_200_000);

    it('refuses control characters and odd ids in the queries and paths of read routes', async () => {
      const reads = listApiRoutes(t.app)
        .filter((r) => r.startsWith('GET /api/') && !r.startsWith('GET /api/docs'))
        .filter((_, i) => i % of === part);
      expect(reads.length).toBeGreaterThan(5);
      const refusedNaming = async (url: string, name: string) => {
        const res = await owner.get(url);
        expect(res.status, `${url}: ${(res.text ?? '').slice(0, 200)}`).toBe(400);
        // A CSV or PDF route's refusal is JSON under the route's own content type.
        const body = (res.body?.fields ? res.body : JSON.parse(res.text)) as {
          fields?: Record<string, string>;
        };
        expect(Object.keys(body.fields ?? {}), url).toContain(name);
      };
      for (const route of reads) {
        const url = route.split(' ')[1]!;
        const op = doc.paths[url.replace(/:(\w+)/g, '{$1}')]?.get;
        const query = (op?.parameters ?? []).filter((p) => p.in === 'query').map((p) => p.name);
        const base = await resolvePath(`GET ${url}`);
        // Routes the owner may not read (the site admin's) answer 403 before any parsing.
        if ((await owner.get(base)).status === 403) continue;
        for (const name of query) {
          await refusedNaming(`${base}?${name}=a%00b`, name);
          await refusedNaming(`${base}?${name}=%07%1b`, name);
          if (/Id$|^page/.test(name)) {
            for (const odd of ODD_IDS)
              await refusedNaming(`${base}?${name}=${encodeURIComponent(odd)}`, name);
          }
        }
        if (url.includes(':id')) {
          for (const odd of ODD_IDS) {
            await refusedNaming(
              url.replace(':id', encodeURIComponent(odd)).replace(/:(\w+)/g, '1'),
              'id',
            );
          }
        }
        await fc.assert(
          fc.asyncProperty(
            fc.array(fc.tuple(fc.constantFrom(...query, 'x'), hostileText), { maxLength: 4 }),
            async (pairs) => {
              const qs = pairs.map(([k, v]) => `${k}=${encodeURIComponent(v)}`).join('&');
              const res = await owner.get(`${base}?${qs}`);
              const text = res.text ?? '';
              const body = res.status >= 400 && !res.body?.message ? JSON.parse(text) : res.body;
              checkRefusal(route, { status: res.status, body, text });
            },
          ),
          { numRuns: Math.ceil(RUNS / 10) },
        );
      }
    }, 1_200_000);
  });
}
