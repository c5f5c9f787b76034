import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';

const repoRoot = resolve(import.meta.dirname, '../../..');
const serverEntry = join(repoRoot, 'packages/api/dist/main.cjs');
const webBuild = join(repoRoot, 'packages/web/dist/index.html');

export type BuiltServer = {
  /** `http://127.0.0.1:<port>` */
  baseUrl: string;
  /** PUBLIC_URL, the origin links in mail start from: `http://localhost:<port>`, the same
   * server under another name, so a test can tell a configured link from the server's own. */
  publicUrl: string;
  port: number;
  stop: () => Promise<void>;
};

function freePort(): Promise<number> {
  return new Promise((done, fail) => {
    const server = createServer();
    server.once('error', fail);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => done(port));
    });
  });
}

async function waitForHealth(url: string, server: ChildProcess, log: () => string) {
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) {
      throw new Error(`The server exited with ${server.exitCode} before it was ready:\n${log()}`);
    }
    try {
      const response = await fetch(`${url}/api/health`);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((done) => setTimeout(done, 250));
  }
  throw new Error(`The server did not answer /api/health within 60 s:\n${log()}`);
}

/**
 * Starts the real production server (built by `npm run build`) on a free port with a fresh data
 * folder and the demo household. Used by the browser tests and the browser benchmark.
 */
export async function startBuiltServer(env: Record<string, string> = {}): Promise<BuiltServer> {
  for (const [file, what] of [
    [serverEntry, 'the API'],
    [webBuild, 'the web app'],
  ] as const) {
    if (!existsSync(file)) {
      throw new Error(`${what} is not built (${file} is missing): run \`npm run build\` first.`);
    }
  }
  const port = await freePort();
  const dataDir = await mkdtemp(join(tmpdir(), 'workback-e2e-'));
  const baseUrl = `http://127.0.0.1:${port}`;
  const publicUrl = `http://localhost:${port}`;
  let output = '';
  const server = spawn(process.execPath, [serverEntry], {
    cwd: repoRoot,
    env: {
      ...process.env,
      PORT: String(port),
      DATA_DIR: dataDir,
      SEED_DEMO: 'true',
      NODE_ENV: 'test',
      // Many journeys sign the same demo accounts in within a minute; the limit has API tests.
      SIGN_IN_LIMIT_PER_MINUTE: '200',
      PUBLIC_URL: publicUrl,
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const keep = (chunk: Buffer) => {
    output = (output + chunk.toString()).slice(-20_000);
  };
  server.stdout?.on('data', keep);
  server.stderr?.on('data', keep);

  try {
    await waitForHealth(baseUrl, server, () => output);
  } catch (error) {
    server.kill('SIGKILL');
    await rm(dataDir, { recursive: true, force: true });
    throw error;
  }

  const stop = async () => {
    if (server.exitCode === null) {
      const exited = new Promise((done) => server.once('exit', done));
      server.kill('SIGTERM');
      const timer = setTimeout(() => server.kill('SIGKILL'), 10_000);
      await exited;
      clearTimeout(timer);
    }
    await rm(dataDir, { recursive: true, force: true });
  };
  return { baseUrl, publicUrl, port, stop };
}
