// Reads the shared fixture tables (data only, each naming its source) for core's tests.
import { readFileSync } from 'node:fs';

/** `readFixture('worked-examples.json')` → the parsed JSON of `fixtures/core/worked-examples.json`. */
export function readFixture<T>(name: string): T {
  const url = new URL(`../../../../fixtures/core/${name}`, import.meta.url);
  return JSON.parse(readFileSync(url, 'utf8')) as T;
}
