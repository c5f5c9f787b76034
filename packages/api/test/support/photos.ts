import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { getConnectionToken } from '@nestjs/sequelize';
import type { Sequelize } from 'sequelize-typescript';
import type { Client, TestApp } from './test-app.js';

const FIXTURES = new URL('../../../../fixtures/photos/', import.meta.url);

export const fixture = (name: string): Buffer => readFileSync(new URL(name, FIXTURES));

export interface Upload {
  name: string;
  data: Buffer;
  type?: string;
}

/** A multipart POST the way the web form sends it: text fields plus `photos` files. */
export function postMultipart(
  client: Client,
  url: string,
  fields: Record<string, string | number>,
  uploads: Upload[] = [],
) {
  let req = client.agent.post(url).set('x-csrf-token', client.token);
  for (const [name, value] of Object.entries(fields)) req = req.field(name, String(value));
  for (const u of uploads) {
    req = req.attach('photos', u.data, { filename: u.name, contentType: u.type ?? 'image/jpeg' });
  }
  return req;
}

export function photoFiles(t: TestApp): string[] {
  try {
    return readdirSync(path.join(t.dataDir, 'photos')).sort();
  } catch {
    return [];
  }
}

export function db(t: TestApp): Sequelize {
  return t.app.get<Sequelize>(getConnectionToken());
}

export async function count(t: TestApp, table: string): Promise<number> {
  const [rows] = await db(t).query(`SELECT COUNT(*) AS n FROM ${table}`);
  return Number((rows as { n: number }[])[0]!.n);
}

/** Rows in every table a miss writes, and the photo files: what must not change after a refusal. */
export async function footprint(t: TestApp) {
  return {
    misses: await count(t, 'misses'),
    missRules: await count(t, 'miss_rules'),
    missDiagnoses: await count(t, 'miss_diagnoses'),
    photos: await count(t, 'photos'),
    files: photoFiles(t),
  };
}

export async function studentIds(client: Client): Promise<Map<string, number>> {
  const res = await client.get('/api/students').expect(200);
  return new Map((res.body.items as { id: number; name: string }[]).map((s) => [s.name, s.id]));
}

export const today = () => new Date().toISOString().slice(0, 10);
