// The better-auth client, made on first use (never at import: it wires up window listeners), and thin wrappers
// that turn better-auth's { data, error } replies into values or ApiErrors like the rest of the API.
import { createAuthClient } from 'better-auth/react';
import { ApiError, type ApiErrorCode, type FieldIssue } from './api-client';
import { resolveApiBaseUrl } from './api-base-url';

export function createPhasewrightAuthClient(apiBaseUrl: string) {
  return createAuthClient({
    baseURL: `${apiBaseUrl}/api/auth`,
    fetchOptions: { credentials: 'include' },
  });
}

export type AuthClient = ReturnType<typeof createPhasewrightAuthClient>;
export type AuthSession = AuthClient['$Infer']['Session'];

let shared: AuthClient | null = null;
export function getAuthClient(): AuthClient {
  shared ??= createPhasewrightAuthClient(resolveApiBaseUrl());
  return shared;
}

interface AuthFailure {
  code?: string;
  message?: string;
  status: number;
  statusText?: string;
}

// better-auth's codes that belong to one form field, so the form can show them under it.
const FIELD_BY_CODE: Record<string, { path: string; message: string }> = {
  USER_ALREADY_EXISTS: { path: 'email', message: 'An account with this e-mail exists already. Sign in instead.' },
  USER_ALREADY_EXISTS_USE_ANOTHER_EMAIL: {
    path: 'email',
    message: 'An account with this e-mail exists already. Sign in instead.',
  },
  INVALID_EMAIL: { path: 'email', message: 'Enter a valid e-mail address.' },
  PASSWORD_TOO_SHORT: { path: 'password', message: 'The password is too short.' },
  PASSWORD_TOO_LONG: { path: 'password', message: 'The password is too long.' },
};

const MESSAGE_BY_CODE: Record<string, string> = {
  INVALID_EMAIL_OR_PASSWORD: 'Wrong e-mail or password.',
  INVALID_TOKEN: 'This reset link is not valid any more. Ask for a new one.',
  TOKEN_EXPIRED: 'This reset link has expired. Ask for a new one.',
};

function codeForStatus(status: number): ApiErrorCode {
  if (status === 0) return 'network';
  if (status === 400 || status === 422) return 'bad_request';
  if (status === 401) return 'unauthorized';
  if (status === 403) return 'forbidden';
  if (status === 404) return 'not_found';
  if (status === 429) return 'conflict';
  return 'internal';
}

export function authFailureToApiError(failure: AuthFailure): ApiError {
  const known = failure.code ? FIELD_BY_CODE[failure.code] : undefined;
  const issues: FieldIssue[] = known ? [known] : [];
  const message =
    known?.message ??
    (failure.code ? MESSAGE_BY_CODE[failure.code] : undefined) ??
    (failure.status === 429 ? 'Too many tries. Wait a moment and try again.' : undefined) ??
    failure.message ??
    (failure.status ? `The server answered ${failure.status}` : 'Cannot reach the server.');
  return new ApiError(failure.status ?? 0, codeForStatus(failure.status ?? 0), message, issues);
}

async function unwrap<T>(call: Promise<{ data: T | null; error: AuthFailure | null }>): Promise<T> {
  let result: { data: T | null; error: AuthFailure | null };
  try {
    result = await call;
  } catch {
    throw new ApiError(0, 'network', 'Cannot reach the server. Check the connection and try again.');
  }
  if (result.error) throw authFailureToApiError(result.error);
  return result.data as T;
}

export const auth = {
  // A guest (a name given on a viewer link's page) counts as signed out everywhere but that page, which asks the
  // link's own route who is there: guests have no projects, and may sign in or make an account like anyone.
  getSession: async (): Promise<AuthSession | null> => {
    const found = (await unwrap(getAuthClient().getSession())) ?? null;
    return (found?.user as { isAnonymous?: boolean | null } | undefined)?.isAnonymous ? null : found;
  },
  signIn: (body: { email: string; password: string }) => unwrap(getAuthClient().signIn.email(body)),
  signUp: (body: { name: string; email: string; password: string }) =>
    unwrap(getAuthClient().signUp.email(body)),
  signOut: () => unwrap(getAuthClient().signOut()),
  requestPasswordReset: (body: { email: string; redirectTo: string }) =>
    unwrap(getAuthClient().requestPasswordReset(body)),
  resetPassword: (body: { newPassword: string; token: string }) => unwrap(getAuthClient().resetPassword(body)),
  /** A guest who opened a viewer link and gave a name: an anonymous account (better-auth's plugin), then the name. */
  signInAsGuest: async (name: string) => {
    const client = getAuthClient();
    await unwrap(client.$fetch('/sign-in/anonymous', { method: 'POST', body: {} }) as Promise<{ data: unknown; error: AuthFailure | null }>);
    await unwrap(client.updateUser({ name }));
  },
};
