// The one typed client for Phasewright's HTTP API: JSON in and out, the session cookie sent along, and every
// failure turned into an ApiError. Runs in the browser and in Node (give it a base URL and, in Node, headers).
import type {
  ApiErrorBody,
  PinAttachmentSummary,
  PinThread,
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
import type { Role } from '../roles';

// Members, invitations, activity, viewer links and preferences: the shapes the server's routes answer with.
import type {
  ListRevisionsResponse,
  ReviewCreateBody,
  ReviewSummary,
  RevisionComparison,
  RevisionCreateBody,
  RevisionResponse,
  RevisionSummary,
} from '../revisions';

export type InvitationState = 'pending' | 'accepted' | 'withdrawn' | 'expired';
export interface InvitationSummary {
  id: string;
  email: string;
  role: Role;
  state: InvitationState;
  sentAt: string;
  expiresAt: string;
}
/** What the invitation page shows before anyone signs in. */
export interface InvitationPreview {
  email: string;
  role: Role;
  projectName: string;
  inviter: string | null;
  expiresAt: string;
}
export interface InvitationCreateBody {
  email: string;
  role: Role;
}
export type ActivityAction = 'invited' | 'invitation-resent' | 'invitation-withdrawn' | 'joined' | 'role-changed' | 'removed';
export interface ActivityEntry {
  id: string;
  action: ActivityAction;
  /** The e-mail address the change was about. */
  subject: string;
  role: Role | null;
  actor: string | null;
  at: string;
}
export type ViewerLinkState = 'active' | 'revoked' | 'expired';
export interface ViewerLinkSummary {
  id: string;
  label: string;
  createdAt: string;
  expiresAt: string | null;
  revokedAt: string | null;
  state: ViewerLinkState;
}
export interface ViewerLinkCreateBody {
  label?: string;
  expiresInDays?: number;
}
/** The new link's address comes back this once; the server keeps only a hash of its token. */
export interface ViewerLinkCreated {
  link: ViewerLinkSummary;
  token: string;
  url: string;
}
export interface Preferences {
  pinEmails: boolean;
}
/** What a viewer link opens, before the sheet's document: names, the link's expiry and who is asking. */
export interface ViewLinkInfo {
  sheet: { id: string; name: string };
  project: { name: string };
  link: { expiresAt: string | null };
  you: { id: string; name: string; guest: boolean } | null;
}
export type { PinAttachmentSummary, PinPerson, PinThread } from '../api';
export interface PinCreateBody {
  body: string;
  elementId?: string | null;
  x: number;
  y: number;
}
/** Where a sheet's pins are reached: as a member, or through a viewer link. */
export type PinPlace = { sheetId: string } | { token: string };

export function pinsPath(place: PinPlace): string {
  return 'token' in place ? `/api/view/${encodeURIComponent(place.token)}/pins` : `/api/sheets/${encodeURIComponent(place.sheetId)}/pins`;
}

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
    const form = typeof FormData !== 'undefined' && body instanceof FormData;
    // A form sets its own multipart content type (with the boundary).
    if (body !== undefined && !form) headers['content-type'] = 'application/json';
    let response: Response;
    try {
      response = await doFetch(`${baseUrl}${path}`, {
        method,
        headers,
        credentials: 'include',
        body: body === undefined ? undefined : form ? (body as FormData) : JSON.stringify(body),
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
    changeMemberRole: (projectId: string, userId: string, role: Role) =>
      request<ListMembersResponse>('PATCH', `/api/projects/${id(projectId)}/members/${id(userId)}`, { role }),
    removeMember: (projectId: string, userId: string) =>
      request<unknown>('DELETE', `/api/projects/${id(projectId)}/members/${id(userId)}`),

    listInvitations: (projectId: string) =>
      request<{ invitations: InvitationSummary[] }>('GET', `/api/projects/${id(projectId)}/invitations`),
    createInvitation: (projectId: string, body: InvitationCreateBody) =>
      request<{ invitation: InvitationSummary }>('POST', `/api/projects/${id(projectId)}/invitations`, body),
    resendInvitation: (projectId: string, invitationId: string) =>
      request<{ invitation: InvitationSummary }>(
        'POST',
        `/api/projects/${id(projectId)}/invitations/${id(invitationId)}/resend`,
      ),
    withdrawInvitation: (projectId: string, invitationId: string) =>
      request<{ invitation: InvitationSummary }>('DELETE', `/api/projects/${id(projectId)}/invitations/${id(invitationId)}`),
    getInvitation: (token: string) => request<{ invitation: InvitationPreview }>('GET', `/api/invitations/${id(token)}`),
    acceptInvitation: (token: string) =>
      request<{ projectId: string; role: Role }>('POST', `/api/invitations/${id(token)}/accept`),

    listActivity: (projectId: string) =>
      request<{ activity: ActivityEntry[] }>('GET', `/api/projects/${id(projectId)}/activity`),

    listViewerLinks: (sheetId: string) => request<{ links: ViewerLinkSummary[] }>('GET', `/api/sheets/${id(sheetId)}/links`),
    createViewerLink: (sheetId: string, body: ViewerLinkCreateBody) =>
      request<ViewerLinkCreated>('POST', `/api/sheets/${id(sheetId)}/links`, body),
    revokeViewerLink: (sheetId: string, linkId: string) =>
      request<{ link: ViewerLinkSummary }>('DELETE', `/api/sheets/${id(sheetId)}/links/${id(linkId)}`),

    getPreferences: () => request<{ preferences: Preferences }>('GET', '/api/me/preferences'),
    updatePreferences: (body: Preferences) =>
      request<{ preferences: Preferences }>('PATCH', '/api/me/preferences', body),

    listOutbox: () => request<OutboxResponse>('GET', '/api/outbox'),

    listRevisions: (sheetId: string) => request<ListRevisionsResponse>('GET', `/api/sheets/${id(sheetId)}/revisions`),
    getRevision: (sheetId: string, number: number) => request<RevisionResponse>('GET', `/api/sheets/${id(sheetId)}/revisions/${number}`),
    issueRevision: (sheetId: string, body: RevisionCreateBody) =>
      request<{ revision: RevisionSummary }>('POST', `/api/sheets/${id(sheetId)}/revisions`, body),
    compareRevision: (sheetId: string, number: number) =>
      request<{ comparison: RevisionComparison }>('GET', `/api/sheets/${id(sheetId)}/revisions/${number}/compare`),
    restoreRevision: (sheetId: string, number: number) =>
      request<{ ok: true; restoredFrom: number }>('POST', `/api/sheets/${id(sheetId)}/revisions/${number}/restore`, {}),
    reviewRevision: (sheetId: string, number: number, body: ReviewCreateBody) =>
      request<{ review: ReviewSummary; revision: RevisionSummary }>('POST', `/api/sheets/${id(sheetId)}/revisions/${number}/reviews`, body),
    // Through a viewer link: look, compare and review (no account needed to look; a name to review).
    listLinkRevisions: (token: string) => request<ListRevisionsResponse>('GET', `/api/view/${id(token)}/revisions`),
    compareLinkRevision: (token: string, number: number) =>
      request<{ comparison: RevisionComparison }>('GET', `/api/view/${id(token)}/revisions/${number}/compare`),
    reviewLinkRevision: (token: string, number: number, body: ReviewCreateBody) =>
      request<{ review: ReviewSummary; revision: RevisionSummary }>('POST', `/api/view/${id(token)}/revisions/${number}/reviews`, body),
    linkRevisionExportUrl: (token: string, number: number, file: string) => `${baseUrl}/api/view/${id(token)}/revisions/${number}/export/${file}`,
    /** Where a download lives (opened by the browser, which sends the session cookie itself). */
    revisionExportUrl: (sheetId: string, number: number, file: string) => `${baseUrl}/api/sheets/${id(sheetId)}/revisions/${number}/export/${file}`,
    sheetExportUrl: (sheetId: string, file: string) => `${baseUrl}/api/sheets/${id(sheetId)}/export/${file}`,
    getViewLink: (token: string) => request<ViewLinkInfo>('GET', `/api/view/${id(token)}`),

    listPins: (place: PinPlace) => request<{ pins: PinThread[] }>('GET', pinsPath(place)),
    addPin: (place: PinPlace, body: PinCreateBody) => request<{ pin: PinThread }>('POST', pinsPath(place), body),
    replyToPin: (place: PinPlace, pinId: string, body: string) =>
      request<{ pin: PinThread }>('POST', `${pinsPath(place)}/${id(pinId)}/replies`, { body }),
    resolvePin: (place: PinPlace, pinId: string, resolved: boolean) =>
      request<{ pin: PinThread }>('PATCH', `${pinsPath(place)}/${id(pinId)}`, { resolved }),
    attachToPin: (place: PinPlace, pinId: string, file: Blob, fileName: string) => {
      const form = new FormData();
      form.append('file', file, fileName);
      return request<{ attachment: PinAttachmentSummary }>('POST', `${pinsPath(place)}/${id(pinId)}/attachments`, form);
    },
    /** Where an attachment is read (an image's thumbnail, a file to open). */
    attachmentUrl: (place: PinPlace, pinId: string, attachmentId: string) =>
      `${baseUrl}${pinsPath(place)}/${id(pinId)}/attachments/${id(attachmentId)}`,
    pinEventsUrl: (place: PinPlace) => `${baseUrl}${pinsPath(place)}/events`,
  };
}

export type ApiClient = ReturnType<typeof createApiClient>;
