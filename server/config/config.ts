import path from 'node:path';
import { z } from 'zod';
import { repoRoot } from '../paths';

const port = z.coerce.number().int().min(0).max(65535);
const origin = z.url({ protocol: /^https?$/ }).transform((value) => value.replace(/\/+$/, ''));

/**
 * Every setting Wardbook's processes read, parsed once from the environment. Defaults give a
 * working local install; CI and tests override ports so they never clash with `npm start`.
 */
const environmentSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  WARDBOOK_DATA_DIR: z.string().min(1).default('.data'),
  WARDBOOK_LOG_LEVEL: z
    .enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'])
    .default('info'),
  WARDBOOK_PG_PORT: port.default(54329),
  WARDBOOK_DB_NAME: z
    .string()
    .regex(/^[a-z_][a-z0-9_]{0,62}$/, 'lower-case letters, digits and underscores')
    .default('wardbook'),
  WARDBOOK_API_PORT: port.default(3000),
  WARDBOOK_IDP_PORT: port.default(3001),
  WARDBOOK_SMTP_PORT: port.default(1025),
  WARDBOOK_MAIL_VIEWER_PORT: port.default(1080),
  /** The local Twilio fake: the Messages API, its status callbacks and a page to reply from. */
  WARDBOOK_TWILIO_PORT: port.default(1090),
  /** The SIA DC-09 alarm receiver (TCP). */
  WARDBOOK_RECEIVER_PORT: port.default(7100),
  /** The HTTPS intake for IP communicators posting signals as JSON (loopback, self-signed). */
  WARDBOOK_INTAKE_PORT: port.default(7443),
  WARDBOOK_DEV_PORT: port.default(5173),
  /** Origin the browser uses for the app; the OIDC redirect comes back here. */
  WARDBOOK_PUBLIC_URL: origin.optional(),
  WARDBOOK_IDP_ISSUER: origin.optional(),
  WARDBOOK_MAIL_FROM: z.string().default('Wardbook <no-reply@wardbook.example.com>'),
  WARDBOOK_CLIENT_DIR: z.string().default('dist'),
});

export type Environment = z.infer<typeof environmentSchema>;

export interface Config {
  env: Environment['NODE_ENV'];
  dataDir: string;
  logLevel: Environment['WARDBOOK_LOG_LEVEL'];
  postgres: { host: string; port: number; database: string; user: string };
  api: { port: number; publicUrl: string; clientDir: string };
  idp: { port: number; issuer: string; appOrigins: string[] };
  mail: { smtpHost: string; smtpPort: number; viewerPort: number; from: string };
  monitoring: { receiverPort: number; intakePort: number };
  twilio: {
    port: number;
    /** Where the SDK's requests go: the local fake's origin. */
    apiBaseUrl: string;
    accountSid: string;
    /** The number keyholders see messages come from, and reply to. */
    from: string;
    /** The app's webhook for keyholders' replies; the fake posts them here, signed. */
    inboundWebhookUrl: string;
  };
  devServerUrl: string;
}

export class ConfigError extends Error {}

/**
 * The local fake's account: shaped like a Twilio Account SID ("AC" and 32 hex digits) but
 * plainly made up, so it is never mistaken for a real account.
 */
export const LOCAL_TWILIO_ACCOUNT_SID = `AC${'fa4e'.repeat(8)}`;
/** Ofcom's range for drama (07700 900000–900999): never a real subscriber. */
export const LOCAL_TWILIO_FROM = '+447700900000';

export function loadConfig(source: NodeJS.ProcessEnv = process.env): Config {
  const parsed = environmentSchema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues
      .map((issue) => `  ${issue.path.join('.')}: ${issue.message}`)
      .join('\n');
    throw new ConfigError(`Wardbook cannot start; these settings are invalid:\n${problems}`);
  }
  const env = parsed.data;
  const publicUrl = env.WARDBOOK_PUBLIC_URL ?? `http://127.0.0.1:${env.WARDBOOK_API_PORT}`;
  const devServerUrl = `http://127.0.0.1:${env.WARDBOOK_DEV_PORT}`;
  return {
    env: env.NODE_ENV,
    dataDir: path.resolve(repoRoot, env.WARDBOOK_DATA_DIR),
    logLevel: env.WARDBOOK_LOG_LEVEL,
    postgres: {
      host: '127.0.0.1',
      port: env.WARDBOOK_PG_PORT,
      database: env.WARDBOOK_DB_NAME,
      user: 'postgres',
    },
    api: {
      port: env.WARDBOOK_API_PORT,
      publicUrl,
      clientDir: path.resolve(repoRoot, env.WARDBOOK_CLIENT_DIR),
    },
    idp: {
      port: env.WARDBOOK_IDP_PORT,
      issuer: env.WARDBOOK_IDP_ISSUER ?? `http://127.0.0.1:${env.WARDBOOK_IDP_PORT}`,
      // Both the built app and Vite's dev server may complete a sign-in.
      appOrigins: [...new Set([publicUrl, devServerUrl])],
    },
    mail: {
      smtpHost: '127.0.0.1',
      smtpPort: env.WARDBOOK_SMTP_PORT,
      viewerPort: env.WARDBOOK_MAIL_VIEWER_PORT,
      from: env.WARDBOOK_MAIL_FROM,
    },
    monitoring: {
      receiverPort: env.WARDBOOK_RECEIVER_PORT,
      intakePort: env.WARDBOOK_INTAKE_PORT,
    },
    twilio: {
      port: env.WARDBOOK_TWILIO_PORT,
      apiBaseUrl: `http://127.0.0.1:${env.WARDBOOK_TWILIO_PORT}`,
      accountSid: LOCAL_TWILIO_ACCOUNT_SID,
      from: LOCAL_TWILIO_FROM,
      inboundWebhookUrl: `${publicUrl}/api/webhooks/twilio/inbound`,
    },
    devServerUrl,
  };
}
