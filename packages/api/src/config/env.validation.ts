import { plainToInstance, Transform } from 'class-transformer';
import {
  IsBoolean,
  IsIn,
  IsInt,
  IsNumber,
  IsOptional,
  IsPositive,
  IsString,
  Max,
  Min,
  validateSync,
} from 'class-validator';

const toBoolean = ({ value }: { value: unknown }) =>
  typeof value === 'string' ? ['1', 'true', 'yes', 'on'].includes(value.toLowerCase()) : value;

/** Every environment variable Workback reads, with its default. README lists them. */
export class EnvironmentVariables {
  @IsIn(['development', 'production', 'test'])
  NODE_ENV: 'development' | 'production' | 'test' = 'development';

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(0)
  @Max(65535)
  PORT = 3000;

  @IsString()
  HOST = '0.0.0.0';

  @IsString()
  DATA_DIR = './data';

  @IsOptional()
  @IsString()
  SESSION_SECRET?: string;

  @Transform(({ value }) => Number(value))
  @IsNumber()
  @IsPositive()
  SESSION_IDLE_MINUTES = 30;

  @Transform(({ value }) => Number(value))
  @IsNumber()
  @IsPositive()
  SESSION_MAX_HOURS = 12;

  @IsString()
  ADMIN_EMAILS = '';

  @Transform(({ value }) => Number(value))
  @IsInt()
  @Min(1)
  SIGN_IN_LIMIT_PER_MINUTE = 5;

  @Transform(toBoolean)
  @IsBoolean()
  SEED_DEMO = true;

  @IsOptional()
  @IsString()
  SMTP_URL?: string;

  @IsString()
  MAIL_FROM = 'Workback <no-reply@workback.test>';

  @IsOptional()
  @IsString()
  PUBLIC_URL?: string;

  @Transform(toBoolean)
  @IsBoolean()
  TRUST_PROXY = false;

  @IsIn(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'])
  LOG_LEVEL = 'info';

  @IsOptional()
  @IsString()
  WEB_DIST?: string;
}

/** ConfigModule's `validate` hook: refuses to start with a clear list of bad variables. */
export function validateEnv(raw: Record<string, unknown>): EnvironmentVariables {
  const present = Object.fromEntries(Object.entries(raw).filter(([, v]) => v !== ''));
  const env = plainToInstance(EnvironmentVariables, present, { exposeDefaultValues: true });
  const errors = validateSync(env, { skipMissingProperties: false });
  if (errors.length > 0) {
    const lines = errors.map(
      (e) => `${e.property}: ${Object.values(e.constraints ?? {}).join(', ')}`,
    );
    throw new Error(`Invalid configuration:\n  ${lines.join('\n  ')}`);
  }
  return env;
}
