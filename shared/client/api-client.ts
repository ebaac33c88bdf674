// The one typed client for Phasewright's HTTP API: JSON in and out, the session cookie sent along, and every
// failure turned into an ApiError. Runs in the browser and in Node (give it a base URL and, in Node, headers).
import type {
  ApiErrorBody,
  Health,
  ListMembersResponse,
  ListProjectsResponse,
  ListSheetsResponse,
  OutboxResponse,
  ProjectCreateBody,
  ProjectPatchBody,
  ProjectResponse,
  SheetCreateBody,
  SheetPatchBody,
  SheetResponse,
} from '../api';

export type ApiErrorCode = ApiErrorBody['error']['code'] | 'network';
export interface FieldIssue {
  path: string;
  message: string;
}

/** A failed API call: the HTTP status (0 when the server could not be reached), the error code and field issues. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: ApiErrorCode;
  readonly issues: FieldIssue[];

  constructor(status: number, code: ApiErrorCode, message: string, issues: FieldIssue[] = []) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.issues = issues;
  }
}

export function isApiError(value: unknown): value is ApiError {
  return value instanceof ApiError;
}

export interface ApiClientOptions {
  /** The API origin, e.g. 'http://localhost:8080'; '' means relative URLs (same origin in a browser). */
  baseUrl: string;
  /** Extra headers on every request; Node callers pass `cookie` and `origin` here. */
  headers?: Record<string, string>;
  fetch?: typeof fetch;
}

const CODE_BY_STATUS: Record<number, ApiErrorCode> = {
  400: 'bad_request',
  401: 'unauthorized',
  403: 'forbidden',
  404: 'not_found',
  409: 'conflict',
  410: 'gone',
};

function isErrorBody(value: unknown): value is ApiErrorBody {
  const error = (value as ApiErrorBody | null)?.error;
  return typeof error === 'object' && error !== null && typeof error.message === 'string';
}

async function readBody(response: Response): Promise<unknown> {
  const text = await response.text();
  if (!text) return null;
  try {
    return JSON.parse(text);
  } catch {
    return text;
  }
}

export function createApiClient(options: ApiClientOptions) {
  const baseUrl = options.baseUrl.replace(/\/+$/, '');
  const doFetch = options.fetch ?? ((input: RequestInfo | URL, init?: RequestInit) => fetch(input, init));

  async function request<T>(method: string, path: string, body?: unknown): Promise<T> {
    const headers: Record<string, string> = { accept: 'application/json', ...options.headers };
    if (body !== undefined) headers['content-type'] = 'application/json';
    let response: Response;
    try {
      response = await doFetch(`${baseUrl}${path}`, {
        method,
        headers,
        credentials: 'include',
        body: body === undefined ? undefined : JSON.stringify(body),
      });
    } catch (cause) {
      throw new ApiError(0, 'network', 'Cannot reach the server. Check the connection and try again.');
    }
    const payload = await readBody(response);
    if (response.ok) return payload as T;
    if (isErrorBody(payload)) {
      const { code, message, issues } = payload.error;
      throw new ApiError(response.status, code, message, issues ?? []);
    }
    const code = CODE_BY_STATUS[response.status] ?? 'internal';
    throw new ApiError(response.status, code, `The server answered ${response.status} ${response.statusText}`.trim());
  }

  const id = (value: string) => encodeURIComponent(value);

  return {
    health: () => request<Health>('GET', '/api/health'),

    listProjects: () => request<ListProjectsResponse>('GET', '/api/projects'),
    createProject: (body: ProjectCreateBody) => request<ProjectResponse>('POST', '/api/projects', body),
    getProject: (projectId: string) => request<ProjectResponse>('GET', `/api/projects/${id(projectId)}`),
    updateProject: (projectId: string, body: ProjectPatchBody) =>
      request<ProjectResponse>('PATCH', `/api/projects/${id(projectId)}`, body),
    deleteProject: (projectId: string) => request<unknown>('DELETE', `/api/projects/${id(projectId)}`),

    listSheets: (projectId: string) => request<ListSheetsResponse>('GET', `/api/projects/${id(projectId)}/sheets`),
    createSheet: (projectId: string, body: SheetCreateBody) =>
      request<SheetResponse>('POST', `/api/projects/${id(projectId)}/sheets`, body),
    getSheet: (sheetId: string) => request<SheetResponse>('GET', `/api/sheets/${id(sheetId)}`),
    renameSheet: (sheetId: string, body: SheetPatchBody) =>
      request<SheetResponse>('PATCH', `/api/sheets/${id(sheetId)}`, body),
    deleteSheet: (sheetId: string) => request<unknown>('DELETE', `/api/sheets/${id(sheetId)}`),

    listMembers: (projectId: string) =>
      request<ListMembersResponse>('GET', `/api/projects/${id(projectId)}/members`),

    listOutbox: () => request<OutboxResponse>('GET', '/api/outbox'),
  };
}

export type ApiClient = ReturnType<typeof createApiClient>;
