// Reads the server's configuration from the environment, with embedded defaults for a developer's machine.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';

const env = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  PUBLIC_URL: z.string().url().optional(),
  DATA_DIR: z.string().min(1).default('./data'),
  DATABASE_URL: z.string().min(1).optional(),
  SMTP_URL: z.string().min(1).optional(),
  MAIL_FROM: z.string().min(3).default('Phasewright <no-reply@phasewright.local>'),
  BETTER_AUTH_SECRET: z.string().min(32, 'BETTER_AUTH_SECRET must be at least 32 characters').optional(),
  // Extra origins allowed to call the API with credentials (the Expo dev server in `npm run dev`).
  DEV_ORIGINS: z.string().optional(),
  SEED_DEMO: z.enum(['true', 'false']).default('true'),
  // Multiplies the per-minute limits on invitations, links and pins (tests raise or lower them).
  RATE_LIMIT_SCALE: z.coerce.number().positive().default(1),
});

export interface ServerConfig {
  port: number;
  publicUrl: string;
  dataDir: string;
  databaseUrl?: string;
  smtpUrl?: string;
  mailFrom: string;
  authSecret: string;
  trustedOrigins: string[];
  seedDemo: boolean;
  rateLimitScale: number;
}

export function readConfig(source: Record<string, string | undefined> = process.env): ServerConfig {
  const parsed = env.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const dataDir = path.resolve(e.DATA_DIR);
  const publicUrl = (e.PUBLIC_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, '');
  const devOrigins = (e.DEV_ORIGINS ?? '').split(',').map((s) => s.trim()).filter(Boolean);
  return {
    port: e.PORT,
    publicUrl,
    dataDir,
    databaseUrl: e.DATABASE_URL,
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    authSecret: e.BETTER_AUTH_SECRET ?? loadOrCreateSecret(dataDir),
    trustedOrigins: [publicUrl, ...devOrigins],
    seedDemo: e.SEED_DEMO === 'true',
    rateLimitScale: e.RATE_LIMIT_SCALE,
  };
}

// A per-install secret, generated on first start and kept beside the data so sessions survive restarts.
function loadOrCreateSecret(dataDir: string): string {
  const file = path.join(dataDir, 'auth-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}
