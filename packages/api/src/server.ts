import { createApp } from './app.factory.js';
import { lowerHelperThreads } from './common/thread-priority.js';

const SHUTDOWN_TIMEOUT_MS = 10_000;

async function bootstrap(): Promise<void> {
  const { app, config } = await createApp();
  await app.listen(config.port, config.host);
  lowerHelperThreads(config.helperThreadNiceness);

  // SIGTERM/SIGINT: stop accepting, let in-flight requests finish, close the
  // databases and the fake mail server (Nest's shutdown hooks), then exit 0.
  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`${signal} received: finishing requests and closing`);
    const force = setTimeout(() => {
      console.error('Shutdown took too long; exiting anyway');
      process.exit(1);
    }, SHUTDOWN_TIMEOUT_MS);
    force.unref();
    app.close().then(
      () => process.exit(0),
      (err: unknown) => {
        console.error(err);
        process.exit(1);
      },
    );
  };
  process.on('SIGTERM', () => stop('SIGTERM'));
  process.on('SIGINT', () => stop('SIGINT'));

  const url = (await app.getUrl()).replace(/\[::1?\]|0\.0\.0\.0|127\.0\.0\.1/, 'localhost');
  console.log(`\nWorkback is running at ${url}`);
  if (config.seedDemo) {
    console.log('Demo sign-ins (password workback-demo):');
    console.log('  parent@workback.test    owner of the demo household');
    console.log('  coparent@workback.test  second parent');
    console.log('  tutor@workback.test     tutor, sees one child');
    console.log('  admin@workback.test     site admin, sees no children’s data');
  }
  if (!config.mail.smtpUrl) {
    console.log(`Mail is caught for development and shown at ${url}/dev/outbox to anyone who`);
    console.log(
      'can reach this server. A real server runs with NODE_ENV=production, SMTP_URL and PUBLIC_URL.',
    );
  }
}

bootstrap().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
