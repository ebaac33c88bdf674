// Resolves the better-auth session of a request; API routes behind requireUser answer 401 without one.
import type { RequestHandler, Response } from 'express';
import { fromNodeHeaders } from 'better-auth/node';
import type { Auth } from '../auth';
import { unauthorized } from './errors';

export interface SessionUser {
  id: string;
  name: string;
  email: string;
}

export function requireUser(auth: Auth): RequestHandler {
  return async (req, res, next) => {
    const found = await auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
    if (!found) return next(unauthorized());
    res.locals.user = { id: found.user.id, name: found.user.name, email: found.user.email } satisfies SessionUser;
    next();
  };
}

export function currentUser(res: Response): SessionUser {
  const u = res.locals.user as SessionUser | undefined;
  if (!u) throw unauthorized();
  return u;
}
