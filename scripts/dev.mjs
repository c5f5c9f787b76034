// `npm run dev`: the API with reload on :3000 and Vite's dev server (proxying /api) side by side.
import { spawn } from 'node:child_process';

const run = (args, name, env = {}) => {
  const child = spawn('npm', args, {
    stdio: 'inherit',
    env: { ...process.env, FORCE_COLOR: '1', ...env },
  });
  child.on('exit', (code) => {
    console.log(`${name} exited with ${code}`);
    process.exit(code ?? 1);
  });
  return child;
};

const children = [
  // Mailed links open the Vite server the developer is using, not the API's own port.
  run(['run', 'start:dev', '-w', 'packages/api'], 'api', {
    // Set before the process starts: the TypeScript hook starts the pool before main.cts runs.
    UV_THREADPOOL_SIZE: process.env.UV_THREADPOOL_SIZE ?? '16',
    PUBLIC_URL: process.env.PUBLIC_URL ?? 'http://localhost:5173',
  }),
  run(['run', 'dev', '-w', 'packages/web'], 'web'),
];
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => children.forEach((c) => c.kill(signal)));
}
