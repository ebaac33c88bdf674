// Per-address limits on the routes a stranger could hammer: invitations, viewer links, pins and link look-ups.
// (Sign-in and sign-up are limited inside better-auth.) Replies are the ApiErrorBody shape with status 429.
import { rateLimit } from 'express-rate-limit';

const limiter = (limit: number, what: string) =>
  rateLimit({
    windowMs: 60_000,
    limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: (_req, res) => {
      res.status(429).json({ error: { code: 'bad_request', message: `Too many ${what} from this address; try again in a minute` } });
    },
  });

export function rateLimits(scale = 1) {
  const n = (x: number) => Math.max(1, Math.round(x * scale));
  return {
    invitations: limiter(n(30), 'invitations'),
    links: limiter(n(30), 'viewer links'),
    pins: limiter(n(60), 'comments'),
    viewLookups: limiter(n(300), 'link requests'),
  };
}
