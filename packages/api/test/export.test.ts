import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { QueryTypes } from 'sequelize';
import { Sequelize } from 'sequelize-typescript';
import type { Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  Client,
  DEMO,
  registered,
  signedIn,
  startTestApp,
  type TestApp,
} from './support/test-app.js';
import { readZip } from './support/zip.js';
import { confirmAddress } from './support/mail.js';

type Row = Record<string, unknown>;

let t: TestApp;
let owner: Client;
let other: Client;
let householdId: number;
let otherHouseholdId: number;

const binary = (res: Response, cb: (err: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
};

async function download(by: Client) {
  const res = await by.get('/api/export').buffer(true).parse(binary);
  expect(res.status, res.status === 200 ? '' : String(res.body)).toBe(200);
  return { res, files: readZip(res.body as Buffer) };
}

const json = (files: Map<string, Buffer>, name: string) =>
  JSON.parse(files.get(name)!.toString('utf8')) as Row[];

const photosDir = () => path.join(t.dataDir, 'photos');
const png = () =>
  sharp({ create: { width: 64, height: 48, channels: 3, background: '#e8e4da' } })
    .png()
    .toBuffer();

/** A miss with one photo through the misses API, when that module is there. */
async function missWithPhoto(by: Client, studentId: number, problem: string) {
  return by.agent
    .post('/api/misses')
    .set('x-csrf-token', by.token)
    .field('studentId', String(studentId))
    .field('occurredOn', '2026-03-02')
    .field('problem', problem)
    .field('answer', '139')
    .field('explanation', 'I took one from the hundreds')
    .field('cause', 'step')
    .attach('photos', await png(), { filename: 'work.png', contentType: 'image/png' });
}

beforeAll(async () => {
  t = await startTestApp({ SMTP_URL: '', SIGN_IN_LIMIT_PER_MINUTE: '1000' });
  owner = await signedIn(t, DEMO.owner);
  householdId = (await owner.get('/api/households/current').expect(200)).body.id;
  other = await registered(t, 'elsewhere-owner@example.test', 'The Elsewhere household');
  await confirmAddress(other, 'elsewhere-owner@example.test');
  otherHouseholdId = (await other.get('/api/households/current').expect(200)).body.id;
  const zed = await other.post('/api/students', { name: 'Zedekiah', gradeLevel: '5' });
  await other
    .post('/api/invitations', {
      email: 'elsewhere-tutor@example.test',
      role: 'tutor',
      studentIds: [zed.body.id],
    })
    .expect(201);
  await owner
    .post('/api/invitations', { email: 'hollow-helper@example.test', role: 'parent' })
    .expect(201);
  const wren = (await owner.get('/api/students').expect(200)).body.items[0].id as number;
  await missWithPhoto(owner, wren, '304 - 75');
  await missWithPhoto(other, zed.body.id, '605 - 37');
});
afterAll(() => t.close());

describe('GET /api/export', () => {
  it('streams a zip named for the day, for the owner only', async () => {
    const { res } = await download(owner);
    expect(res.headers['content-type']).toBe('application/zip');
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename="workback-export-\d{4}-\d{2}-\d{2}\.zip"$/,
    );
    expect((await (await signedIn(t, DEMO.parent)).get('/api/export')).status).toBe(403);
    expect((await (await signedIn(t, DEMO.tutor)).get('/api/export')).status).toBe(403);
  });

  it('holds exactly this household’s rows in every table, and nothing of another household', async () => {
    const { files } = await download(owner);
    const manifest = JSON.parse(files.get('manifest.json')!.toString('utf8'));
    expect(manifest.household).toEqual({ id: householdId, name: 'The Hollow Lane household' });

    expect(json(files, 'tables/households.json').map((h) => h.id)).toEqual([householdId]);
    const students = (await owner.get('/api/students').expect(200)).body.items.map(
      (s: { id: number }) => s.id,
    );
    expect(
      json(files, 'tables/students.json')
        .map((s) => s.id)
        .sort(),
    ).toEqual([...students].sort());

    // Every table that carries a household_id: all rows ours, and all our rows there.
    const db = t.app.get(Sequelize);
    for (const [name, content] of files) {
      if (!name.startsWith('tables/')) continue;
      const rows = JSON.parse(content.toString('utf8')) as Row[];
      expect(Object.keys(manifest.tables)).toContain(name.slice(7, -5));
      expect(rows.length).toBe(manifest.tables[name.slice(7, -5)]);
      if (rows.length && 'household_id' in rows[0]!) {
        expect(
          rows.every((r) => r.household_id === householdId),
          name,
        ).toBe(true);
        const [{ n } = { n: -1 }] = await db.query<{ n: number }>(
          `SELECT CAST(COUNT(*) AS INTEGER) AS n FROM "${name.slice(7, -5)}" WHERE household_id = ?`,
          { replacements: [householdId], type: QueryTypes.SELECT },
        );
        expect(rows.length, name).toBe(n);
      }
    }
    const memberships = json(files, 'tables/memberships.json');
    expect(memberships).toHaveLength(3);
    const grants = json(files, 'tables/student_grants.json');
    expect(grants.length).toBeGreaterThan(0);
    expect(grants.every((g) => students.includes(g.student_id))).toBe(true);

    const users = json(files, 'tables/users.json');
    expect(users.map((u) => u.email).sort()).toEqual([DEMO.parent, DEMO.owner, DEMO.tutor].sort());
    expect(json(files, 'tables/invitations.json').map((i) => i.email)).toEqual([
      'hollow-helper@example.test',
    ]);

    const everything = [...files.values()].map((b) => b.toString('latin1')).join('\n');
    for (const foreign of [
      'Zedekiah',
      'Elsewhere',
      'elsewhere-owner@example.test',
      'elsewhere-tutor',
      '605 - 37',
    ]) {
      expect(everything, foreign).not.toContain(foreign);
    }
    expect(everything).not.toMatch(/password_hash|token_hash|\$argon2/);
    expect(files.has('tables/password_reset_tokens.json')).toBe(false);
    expect(files.has('tables/schema_migrations.json')).toBe(false);
  });

  it('includes this household’s photo files and not another’s', async () => {
    const { files } = await download(owner);
    if (!files.has('tables/photos.json'))
      throw new Error('the photos table is missing from the export');
    const photos = json(files, 'tables/photos.json');
    expect(photos.length).toBeGreaterThan(0);
    for (const p of photos) {
      // The list rows' small square has no column: its name follows from the display image's.
      const small = (p.storage_key as string).replace(/\.jpg$/, '-small.jpg');
      for (const key of [p.storage_key, p.thumb_key, small] as string[]) {
        const file = files.get(`photos/${key}`);
        expect(file, key).toBeDefined();
        expect((await sharp(file!).metadata()).format).toBeDefined();
      }
    }
    const inZip = [...files.keys()].filter((n) => n.startsWith('photos/'));
    expect(inZip).toHaveLength(photos.length * 3);
    expect(readdirSync(photosDir()).filter((f) => !f.startsWith('.')).length).toBeGreaterThan(
      inZip.length,
    );
  });
});

describe('DELETE /api/households/current', () => {
  it('wants the household’s name typed again, and the owner', async () => {
    const none = await other.send('delete', '/api/households/current', {});
    expect(none.status).toBe(400);
    expect(none.body.fields).toHaveProperty('confirm');
    const wrong = await other.send('delete', '/api/households/current', {
      confirm: 'the elsewhere household',
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.fields.confirm).toMatch(/The Elsewhere household/);
    const parent = await signedIn(t, DEMO.parent);
    expect(
      (
        await parent.send('delete', '/api/households/current', {
          confirm: 'The Hollow Lane household',
        })
      ).status,
    ).toBe(403);
    await other.get('/api/students').expect(200);
  });

  it('removes every row and file of the household, closes accounts left with none, and leaves others whole', async () => {
    const db = t.app.get(Sequelize);
    const before = await download(owner);
    const ourPhotos = json(before.files, 'tables/photos.json');
    const theirFiles = (
      await db.query<{ storage_key: string; thumb_key: string }>(
        'SELECT p.storage_key, p.thumb_key FROM photos p JOIN misses m ON m.id = p.miss_id WHERE m.household_id = ?',
        { replacements: [otherHouseholdId], type: QueryTypes.SELECT },
      )
    ).flatMap((p) => [p.storage_key, p.thumb_key, p.storage_key.replace(/\.jpg$/, '-small.jpg')]);
    expect(theirFiles.length).toBeGreaterThan(0);
    for (const key of theirFiles) expect(existsSync(path.join(photosDir(), key)), key).toBe(true);

    // The tutor also belongs to another household: their account must survive.
    const tutorBoth = await registered(t, 'both-ways@example.test', 'The Both household');
    await db.query(
      "INSERT INTO memberships (household_id, user_id, role, created_at, updated_at) SELECT ?, id, 'parent', CURRENT_TIMESTAMP, CURRENT_TIMESTAMP FROM users WHERE email = 'both-ways@example.test'",
      { replacements: [otherHouseholdId] },
    );

    const res = await other.send('delete', '/api/households/current', {
      confirm: ' The Elsewhere household ',
    });
    expect(res.status, res.text).toBe(200);
    expect(res.body).toMatchObject({
      householdId: otherHouseholdId,
      yourAccountClosed: true,
      accountsClosed: 1,
    });
    expect(res.body.rows.households).toBe(1);

    // Signed out, and the account is gone.
    expect((await other.get('/api/auth/me')).status).toBe(401);
    expect(
      (await new Client(t.http()).signIn('elsewhere-owner@example.test', 'a-long-enough-password'))
        .status,
    ).toBe(401);

    for (const table of ['households', 'students', 'memberships', 'invitations', 'misses']) {
      const [{ n } = { n: -1 }] = await db.query<{ n: number }>(
        `SELECT CAST(COUNT(*) AS INTEGER) AS n FROM "${table}" WHERE ${table === 'households' ? 'id' : 'household_id'} = ?`,
        { replacements: [otherHouseholdId], type: QueryTypes.SELECT },
      );
      expect(n, table).toBe(0);
    }
    for (const key of theirFiles) expect(existsSync(path.join(photosDir(), key)), key).toBe(false);

    // The member of two households keeps their account and their other household.
    expect((await tutorBoth.get('/api/households/current').expect(200)).body.name).toBe(
      'The Both household',
    );

    // The demo household is untouched.
    const after = await download(owner);
    expect(json(after.files, 'tables/students.json')).toEqual(
      json(before.files, 'tables/students.json'),
    );
    expect(json(after.files, 'tables/photos.json')).toEqual(ourPhotos);
    for (const p of ourPhotos)
      expect(existsSync(path.join(photosDir(), p.storage_key as string))).toBe(true);
  });
});
