import { openDB, type DBSchema, type IDBPDatabase } from 'idb';

/** A photo of a draft, as bytes (Blobs in IndexedDB are less dependable across phones). */
export type DraftPhoto = { name: string; type: string; bytes: ArrayBuffer };

/**
 * A write kept on this phone until the connection returns: a multipart POST with its text
 * fields and photos, and the Idempotency-Key that makes sending it again harmless.
 */
export type Draft = {
  /** The Idempotency-Key; also the draft's id on the phone. */
  key: string;
  householdId: number;
  /** The API path it is posted to, e.g. `/misses`. */
  path: string;
  fields: Record<string, string>;
  photos: DraftPhoto[];
  /** What the waiting list shows: e.g. the problem, and the child and day. */
  title: string;
  detail: string;
  keptAt: string;
  /** Set when the server refused it (bad input): it is not sent again until the parent acts. */
  refusal: string | null;
  /** The fields the refusal named, field → message (drafts kept before this have none). */
  refusalFields?: Record<string, string>;
};

interface DraftsDb extends DBSchema {
  drafts: { key: string; value: Draft; indexes: { household: number } };
}

const DB_NAME = 'workback-drafts';
let db: Promise<IDBPDatabase<DraftsDb>> | null = null;

function open(): Promise<IDBPDatabase<DraftsDb>> {
  db ??= openDB<DraftsDb>(DB_NAME, 1, {
    upgrade(database) {
      const store = database.createObjectStore('drafts', { keyPath: 'key' });
      store.createIndex('household', 'householdId');
    },
  });
  return db;
}

// ── A small external store, so every open list updates when a draft is kept or sent ──

let snapshot: readonly Draft[] = [];
let loaded = false;
const listeners = new Set<() => void>();
const channel =
  typeof BroadcastChannel === 'undefined' ? null : new BroadcastChannel('workback-drafts');
channel?.addEventListener('message', () => void reload());

async function reload(): Promise<readonly Draft[]> {
  const all = await (await open()).getAll('drafts');
  snapshot = all.sort((a, b) => a.keptAt.localeCompare(b.keptAt));
  loaded = true;
  listeners.forEach((listener) => listener());
  return snapshot;
}

async function changed(): Promise<void> {
  await reload();
  channel?.postMessage('changed');
}

export function subscribeDrafts(listener: () => void): () => void {
  listeners.add(listener);
  if (!loaded) void reload().catch(() => undefined);
  return () => listeners.delete(listener);
}

export const getDraftsSnapshot = (): readonly Draft[] => snapshot;

export async function listDrafts(): Promise<readonly Draft[]> {
  return reload();
}

export async function keepDraft(draft: Draft): Promise<void> {
  await (await open()).put('drafts', draft);
  await changed();
}

export async function removeDraft(key: string): Promise<void> {
  await (await open()).delete('drafts', key);
  await changed();
}

export async function markRefused(
  key: string,
  refusal: string,
  refusalFields: Record<string, string> = {},
): Promise<void> {
  const database = await open();
  const draft = await database.get('drafts', key);
  if (!draft) return;
  await database.put('drafts', { ...draft, refusal, refusalFields });
  await changed();
}

/**
 * Puts an edited draft in place of the one it was made from, in one step (its key may be new:
 * a key the server already used for other content cannot be sent again).
 */
export async function replaceDraft(oldKey: string, draft: Draft): Promise<void> {
  const tx = (await open()).transaction('drafts', 'readwrite');
  if (oldKey !== draft.key) await tx.store.delete(oldKey);
  await tx.store.put(draft);
  await tx.done;
  await changed();
}

/** A fresh Idempotency-Key: 128 random bits as hex (works on plain http, unlike randomUUID). */
export function newDraftKey(): string {
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, (b) => b.toString(16).padStart(2, '0')).join('');
}

export async function photosOf(files: readonly File[]): Promise<DraftPhoto[]> {
  return Promise.all(
    files.map(async (f) => ({ name: f.name, type: f.type, bytes: await f.arrayBuffer() })),
  );
}

export function formOf(draft: Draft): FormData {
  const form = new FormData();
  for (const [name, value] of Object.entries(draft.fields)) form.set(name, value);
  for (const photo of draft.photos) {
    form.append('photos', new Blob([photo.bytes], { type: photo.type }), photo.name);
  }
  return form;
}
