import type { EnvironmentVariables } from '../config/env.validation.js';

/**
 * With DATABASE_URL the data is in PostgreSQL (and photos, with S3_*, in a bucket): the SQLite
 * backup cannot copy them, so the backup and restore commands say what to use instead.
 * The URL is never printed (it may hold a password); the commands read it from the environment.
 */
export function postgresGuidance(env: EnvironmentVariables, command: 'backup' | 'restore'): string {
  const day = new Date().toISOString().slice(0, 10);
  const photos = env.S3_ENDPOINT
    ? `Photos are in the bucket "${env.S3_BUCKET}" at ${env.S3_ENDPOINT}: keep them with the object store's own versioning, replication or a scheduled copy of the bucket.`
    : `Photos are in each process's DATA_DIR/photos folder: copy that folder (set S3_* so every process shares one bucket).`;
  const lines =
    command === 'backup'
      ? [
          'Workback keeps its data in PostgreSQL (DATABASE_URL): back it up with PostgreSQL’s own tool, which is safe while the servers run:',
          `  pg_dump --format=custom --file=workback-${day}.dump "$DATABASE_URL"`,
          'The dump holds every household, the sessions and the limits.',
          photos,
        ]
      : [
          'Workback keeps its data in PostgreSQL (DATABASE_URL): restore a pg_dump file with pg_restore, with every server process stopped:',
          `  pg_restore --clean --if-exists --no-owner --dbname="$DATABASE_URL" workback-${day}.dump`,
          photos.replace('keep them with', 'restore them from'),
          'Start the servers again afterwards; they check the schema at start.',
        ];
  return `${lines.join('\n')}\nNothing was ${command === 'backup' ? 'written' : 'restored'} by npm run ${command}.`;
}
