// Resolves the better-auth session of a request. Project routes (requireUser) answer 401 without a session and
// 403 for a guest: guests (anonymous accounts made to comment through a viewer link) only reach the link's routes.
import type { IncomingHttpHeaders } from 'node:http';
import type { RequestHandler, Response } from 'express';
import { fromNodeHeaders } from 'better-auth/node';
import type { Auth } from '../auth';
import { forbidden, unauthorized } from './errors';

export interface SessionUser {
  id: string;
  name: string;
  email: string;
  isGuest: boolean;
}

export async function sessionUser(auth: Auth, headers: IncomingHttpHeaders): Promise<SessionUser | null> {
  const found = await auth.api.getSession({ headers: fromNodeHeaders(headers) });
  if (!found) return null;
  const u = found.user as typeof found.user & { isAnonymous?: boolean | null };
  return { id: u.id, name: u.name, email: u.email, isGuest: Boolean(u.isAnonymous) };
}

export function requireUser(auth: Auth): RequestHandler {
  return async (req, res, next) => {
    const user = await sessionUser(auth, req.headers);
    if (!user) return next(unauthorized());
    if (user.isGuest) return next(forbidden('A guest can only look at the sheet of the link they opened'));
    res.locals.user = user;
    next();
  };
}

/** For viewer-link routes: the session user if any (a member, a signed-in outsider or a guest), else null. */
export function optionalUser(auth: Auth): RequestHandler {
  return async (req, res, next) => {
    res.locals.user = (await sessionUser(auth, req.headers)) ?? undefined;
    next();
  };
}

export function currentUser(res: Response): SessionUser {
  const u = res.locals.user as SessionUser | undefined;
  if (!u) throw unauthorized();
  return u;
}

export function maybeUser(res: Response): SessionUser | null {
  return (res.locals.user as SessionUser | undefined) ?? null;
}
