import { createApp } from './app.factory.js';

async function bootstrap(): Promise<void> {
  const { app, config } = await createApp();
  await app.listen(config.port, config.host);
  const url = await app.getUrl();
  const local = url
    .replace('[::1]', 'localhost')
    .replace('0.0.0.0', 'localhost')
    .replace('127.0.0.1', 'localhost');
  console.log(`\nWorkback is running at ${local}`);
  if (config.seedDemo) {
    console.log('Demo sign-ins (password workback-demo):');
    console.log('  parent@workback.test    owner of the demo household');
    console.log('  coparent@workback.test  second parent');
    console.log('  tutor@workback.test     tutor, sees one child');
    console.log('  admin@workback.test     site admin, sees no children’s data');
  }
}

bootstrap().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
