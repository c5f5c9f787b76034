import { registerAs } from '@nestjs/config';
import { fileURLToPath } from 'node:url';
import path from 'node:path';
import { assertProductionReady, validateEnv } from './env.validation.js';
import { loadOrCreateSecret } from './session-secret.js';

export const DEMO_ADMIN_EMAIL = 'admin@workback.test';

export interface AppConfig {
  env: 'development' | 'production' | 'test';
  port: number;
  host: string;
  dataDir: string;
  databaseFile: string;
  sessionsFile: string;
  photosDir: string;
  webDist: string;
  publicUrl: string | undefined;
  trustProxy: boolean;
  logLevel: string;
  seedDemo: boolean;
  adminEmails: readonly string[];
  signInLimitPerMinute: number;
  /** Applied by the server's entry (`lowerHelperThreads`), not by an app a test builds. */
  helperThreadNiceness: number;
  /** What anyone can make the server do, per window (issue 13). */
  limits: {
    invitationsPerHouseholdPerHour: number;
    invitationsPerAddressPerDay: number;
    resetMailsPerAddressPerHour: number;
    photoDecodesPerMember: number;
    photoPixelsPerRequest: number;
    bodyTimeoutMs: number;
  };
  session: {
    secret: string;
    idleMs: number;
    maxAgeMs: number;
    cookieName: string;
    secure: boolean;
  };
  mail: { smtpUrl: string | undefined; from: string };
  /** Set: PostgreSQL holds the data, the sessions and the limits (shared by every process). */
  databaseUrl: string | undefined;
  /** Set: photos live in this S3-compatible bucket instead of `photosDir`. */
  s3: S3Settings | undefined;
}

export interface S3Settings {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
}

const defaultWebDist = fileURLToPath(new URL('../../../web/dist', import.meta.url));

export const appConfig = registerAs('app', (): AppConfig => {
  const env = validateEnv(process.env);
  assertProductionReady(env);
  // The demo (with its published password) is never seeded in production unless asked for.
  const seedDemo = env.SEED_DEMO ?? env.NODE_ENV !== 'production';
  const dataDir = path.resolve(env.DATA_DIR);
  const admins = env.ADMIN_EMAILS.split(',')
    .map((e) => e.trim().toLowerCase())
    .filter(Boolean);
  // The demo's site-admin sign-in only exists when the demo household is seeded.
  if (seedDemo && !admins.includes(DEMO_ADMIN_EMAIL)) admins.push(DEMO_ADMIN_EMAIL);
  return {
    env: env.NODE_ENV,
    port: env.PORT,
    host: env.HOST,
    dataDir,
    databaseFile: path.join(dataDir, 'workback.sqlite'),
    sessionsFile: path.join(dataDir, 'sessions.sqlite'),
    photosDir: path.join(dataDir, 'photos'),
    webDist: env.WEB_DIST ? path.resolve(env.WEB_DIST) : defaultWebDist,
    publicUrl: env.PUBLIC_URL,
    trustProxy: env.TRUST_PROXY,
    logLevel: env.NODE_ENV === 'test' && !process.env.LOG_LEVEL ? 'silent' : env.LOG_LEVEL,
    seedDemo,
    adminEmails: admins,
    signInLimitPerMinute: env.SIGN_IN_LIMIT_PER_MINUTE,
    helperThreadNiceness: env.HELPER_THREAD_NICENESS,
    limits: {
      invitationsPerHouseholdPerHour: env.INVITATIONS_PER_HOUSEHOLD_PER_HOUR,
      invitationsPerAddressPerDay: env.INVITATIONS_PER_ADDRESS_PER_DAY,
      resetMailsPerAddressPerHour: env.RESET_MAILS_PER_ADDRESS_PER_HOUR,
      photoDecodesPerMember: env.PHOTO_DECODES_PER_MEMBER,
      photoPixelsPerRequest: Math.round(env.PHOTO_MEGAPIXELS_PER_REQUEST * 1_000_000),
      bodyTimeoutMs: Math.round(env.BODY_TIMEOUT_SECONDS * 1000),
    },
    session: {
      secret: env.SESSION_SECRET ?? loadOrCreateSecret(dataDir),
      idleMs: env.SESSION_IDLE_MINUTES * 60_000,
      maxAgeMs: env.SESSION_MAX_HOURS * 3_600_000,
      cookieName: 'workback.sid',
      secure: env.NODE_ENV === 'production' && env.TRUST_PROXY,
    },
    mail: { smtpUrl: env.SMTP_URL, from: env.MAIL_FROM },
    databaseUrl: env.DATABASE_URL,
    s3: env.S3_ENDPOINT
      ? {
          endpoint: env.S3_ENDPOINT,
          bucket: env.S3_BUCKET!,
          region: env.S3_REGION,
          accessKeyId: env.S3_ACCESS_KEY_ID!,
          secretAccessKey: env.S3_SECRET_ACCESS_KEY!,
        }
      : undefined,
  };
});
