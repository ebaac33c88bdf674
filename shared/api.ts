// The HTTP API's contract: request bodies as zod schemas, responses as types. Server and client both import this file.
import { z } from 'zod';
import { ROLES, type Role } from './roles';

const name = (what: string) =>
  z
    .string({ error: `${what} name is required` })
    .trim()
    .min(1, `${what} name must not be empty`)
    .max(120, `${what} name must be at most 120 characters`);

export const projectCreateBody = z.strictObject({
  name: name('Project'),
  description: z.string().trim().max(2000, 'Description must be at most 2000 characters').optional(),
});
export const projectPatchBody = projectCreateBody.partial().refine((v) => Object.keys(v).length > 0, {
  message: 'Give at least one field to change',
});
export const sheetCreateBody = z.strictObject({ name: name('Sheet') });
export const sheetPatchBody = sheetCreateBody;

export const idParam = z.string().uuid('Not a valid id');
export const roleSchema = z.enum(ROLES);

export type ProjectCreateBody = z.infer<typeof projectCreateBody>;
export type ProjectPatchBody = z.infer<typeof projectPatchBody>;
export type SheetCreateBody = z.infer<typeof sheetCreateBody>;
export type SheetPatchBody = z.infer<typeof sheetPatchBody>;

export interface UserRef {
  id: string;
  name: string;
}

export interface ProjectSummary {
  id: string;
  name: string;
  description: string;
  role: Role;
  sheetCount: number;
  createdAt: string;
  updatedAt: string;
}

export interface SheetSummary {
  id: string;
  projectId: string;
  name: string;
  createdAt: string;
  updatedAt: string;
  createdBy: UserRef | null;
  updatedBy: UserRef | null;
}

export interface MemberSummary {
  userId: string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
  lastActiveAt: string | null;
}

export interface OutboxMessage {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}

export interface Health {
  ok: true;
  version: string;
  mail: 'local-sink' | 'smtp';
}

/** Every error reply has this shape. `issues` lists field paths for a 400. */
export interface ApiErrorBody {
  error: {
    code: 'bad_request' | 'unauthorized' | 'forbidden' | 'not_found' | 'conflict' | 'gone' | 'internal';
    message: string;
    issues?: { path: string; message: string }[];
  };
}

// Pins, as the pin routes answer (member and viewer-link routes alike).
export interface PinPerson {
  id: string | null;
  name: string;
}
export interface PinAttachmentSummary {
  id: string;
  fileName: string;
  mediaType: string;
  sizeBytes: number;
}
/** A pin with its thread. */
export interface PinThread {
  id: string;
  number: number;
  elementId: string | null;
  x: number;
  y: number;
  author: PinPerson;
  body: string;
  createdAt: string;
  resolvedAt: string | null;
  replies: { id: string; author: PinPerson; body: string; createdAt: string }[];
  attachments: PinAttachmentSummary[];
}

// Responses, route by route.
export interface ListProjectsResponse { projects: ProjectSummary[] }
export interface ProjectResponse { project: ProjectSummary }
export interface ListSheetsResponse { sheets: SheetSummary[] }
export interface SheetResponse { sheet: SheetSummary; project: { id: string; name: string; role: Role } }
export interface ListMembersResponse { members: MemberSummary[] }
export interface OutboxResponse { messages: OutboxMessage[] }
