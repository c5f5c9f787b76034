import { type ChildProcess, spawn } from 'node:child_process';
import { fileURLToPath } from 'node:url';

const apiRoot = fileURLToPath(new URL('../..', import.meta.url));

export interface ServerProcess {
  child: ChildProcess;
  url: string;
  output: () => string;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

/**
 * The real server (src/main.cts, which imports server.ts, through swc-node) as its own process, on
 * a free port. The TypeScript hook starts libuv's thread pool before main.cts runs, so the pool's
 * size is given here, as production's entry gives it.
 * `nodeArgs` go before the script (a bench passes `--cpu-prof`, which NODE_OPTIONS refuses).
 */
export async function startServerProcess(
  env: Record<string, string>,
  nodeArgs: readonly string[] = [],
): Promise<ServerProcess> {
  const child = spawn(
    process.execPath,
    [
      ...nodeArgs,
      '--conditions=workback-source',
      '--import',
      '@swc-node/register/esm-register',
      'src/main.cts',
    ],
    {
      cwd: apiRoot,
      // DATABASE_URL only when the test gives one: process.env may hold the last test app's.
      env: {
        ...process.env,
        NODE_ENV: 'test',
        UV_THREADPOOL_SIZE: process.env.UV_THREADPOOL_SIZE ?? '16',
        PORT: '0',
        HOST: '127.0.0.1',
        DATABASE_URL: '',
        ...env,
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  let out = '';
  child.stdout!.on('data', (d: Buffer) => (out += d.toString()));
  child.stderr!.on('data', (d: Buffer) => (out += d.toString()));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.on('exit', (code, signal) => resolve({ code, signal })),
  );
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start:\n${out}`)), 150_000);
    const check = () => {
      const match = /running at (http:\/\/\S+)/.exec(out);
      if (match) {
        clearTimeout(timer);
        resolve(match[1]!.replace('localhost', '127.0.0.1'));
      }
    };
    child.stdout!.on('data', check);
    void exited.then(() => reject(new Error(`server exited early:\n${out}`)));
  });
  return { child, url, output: () => out, exited };
}
