// better-auth: e-mail and password sign-in with session cookies, password reset by e-mail.
import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { anonymous } from 'better-auth/plugins/anonymous';
import type { Database } from '../db/client';
import { account, session, user, verification } from '../db/schema';
import type { ServerConfig } from './config';
import type { Mailer } from './mail/mailer';
import { passwordResetMail } from './mail/templates';

export function createAuth(db: Database, config: ServerConfig, mailer: Mailer) {
  return betterAuth({
    appName: 'Phasewright',
    baseURL: config.publicUrl,
    basePath: '/api/auth',
    secret: config.authSecret,
    trustedOrigins: config.trustedOrigins,
    database: drizzleAdapter(db, { provider: 'pg', schema: { user, session, account, verification } }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: 8,
      maxPasswordLength: 128,
      autoSignIn: true,
      resetPasswordTokenExpiresIn: 60 * 60,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user: u, url }) => {
        await mailer.send({ to: u.email, ...passwordResetMail(u.name, url) });
      },
    },
    session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
    // Guests who open a viewer link and give a name to comment get an anonymous account of their own.
    plugins: [anonymous({ emailDomainName: 'guests.phasewright.invalid', disableDeleteAnonymousUser: true })],
    // On in every environment (not only production): sign-in, sign-up and guest sign-in per address per minute.
    rateLimit: {
      enabled: true,
      window: 60,
      max: 300,
      customRules: {
        '/sign-in/email': { window: 60, max: 30 },
        '/sign-up/email': { window: 60, max: 30 },
        '/sign-in/anonymous': { window: 60, max: 20 },
        '/request-password-reset': { window: 60, max: 10 },
      },
    },
    telemetry: { enabled: false },
  });
}

export type Auth = ReturnType<typeof createAuth>;
