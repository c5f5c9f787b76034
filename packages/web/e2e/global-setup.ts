import type { TestProject } from 'vitest/node';

import { startBuiltServer } from './built-server';

declare module 'vitest' {
  export interface ProvidedContext {
    baseUrl: string;
    publicUrl: string;
  }
}

/**
 * Starts the real production server (built by `npm run build`) on a free port with a fresh data
 * folder and the demo household, provides its URL as `baseUrl` (and its PUBLIC_URL as `publicUrl`), and stops it afterwards.
 */
export default async function setup(project: TestProject) {
  const server = await startBuiltServer();
  project.provide('baseUrl', server.baseUrl);
  project.provide('publicUrl', server.publicUrl);
  return server.stop;
}
