// TanStack Query hooks over the API client and the auth client: one key scheme, and each change invalidates what
// it makes stale (a new sheet changes the project's sheet list and the sheet count in the projects list).
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { ProjectCreateBody, ProjectPatchBody, SheetPatchBody, SheetCreateBody } from '../api';
import type { Role } from '../roles';
import {
  createApiClient,
  type ApiClient,
  type InvitationCreateBody,
  type Preferences,
  type ViewerLinkCreateBody,
} from './api-client';
import { resolveApiBaseUrl } from './api-base-url';
import type { ReviewCreateBody, RevisionCreateBody } from '../revisions';
import { auth } from './auth-client';

let sharedApi: ApiClient | null = null;
/** The app's API client, made on first use so that nothing reads `window` at import. */
export function getApiClient(): ApiClient {
  sharedApi ??= createApiClient({ baseUrl: resolveApiBaseUrl() });
  return sharedApi;
}

export const queryKeys = {
  session: ['session'] as const,
  projects: ['projects'] as const,
  project: (projectId: string) => ['projects', projectId] as const,
  sheets: (projectId: string) => ['projects', projectId, 'sheets'] as const,
  members: (projectId: string) => ['projects', projectId, 'members'] as const,
  sheet: (sheetId: string) => ['sheets', sheetId] as const,
  outbox: ['outbox'] as const,
  health: ['health'] as const,
  invitations: (projectId: string) => ['projects', projectId, 'invitations'] as const,
  activity: (projectId: string) => ['projects', projectId, 'activity'] as const,
  invitation: (token: string) => ['invitation', token] as const,
  viewerLinks: (sheetId: string) => ['sheets', sheetId, 'links'] as const,
  preferences: ['preferences'] as const,
  revisions: (sheetId: string) => ['sheets', sheetId, 'revisions'] as const,
  revision: (sheetId: string, number: number) => ['sheets', sheetId, 'revisions', number] as const,
  comparison: (sheetId: string, number: number) => ['sheets', sheetId, 'revisions', number, 'compare'] as const,
  linkRevisions: (token: string) => ['view', token, 'revisions'] as const,
  linkComparison: (token: string, number: number) => ['view', token, 'revisions', number, 'compare'] as const,
};

// Session

export function useSession() {
  return useQuery({ queryKey: queryKeys.session, queryFn: auth.getSession, staleTime: 60_000 });
}

export function useSignIn() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: auth.signIn,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.session }),
  });
}

export function useSignUp() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: auth.signUp,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.session }),
  });
}

/** Drops everything cached for the signed-in user, so the next user never sees it. */
export function forgetSignedInData(client: QueryClient) {
  client.setQueryData(queryKeys.session, null);
  client.removeQueries({ predicate: (query) => query.queryKey[0] !== queryKeys.session[0] });
}

export function useSignOut() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: auth.signOut,
    onSettled: () => forgetSignedInData(client),
  });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: auth.requestPasswordReset });
}

export function useResetPassword() {
  return useMutation({ mutationFn: auth.resetPassword });
}

// Projects

export function useProjects() {
  return useQuery({
    queryKey: queryKeys.projects,
    queryFn: async () => (await getApiClient().listProjects()).projects,
  });
}

export function useProject(projectId: string | undefined) {
  return useQuery({
    queryKey: queryKeys.project(projectId ?? ''),
    queryFn: async () => (await getApiClient().getProject(projectId!)).project,
    enabled: !!projectId,
  });
}

export function useCreateProject() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: ProjectCreateBody) => (await getApiClient().createProject(body)).project,
    onSuccess: (project) => {
      client.setQueryData(queryKeys.project(project.id), project);
      return client.invalidateQueries({ queryKey: queryKeys.projects, exact: true });
    },
  });
}

export function useUpdateProject(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: ProjectPatchBody) => (await getApiClient().updateProject(projectId, body)).project,
    onSuccess: (project) => {
      client.setQueryData(queryKeys.project(project.id), project);
      return client.invalidateQueries({ queryKey: queryKeys.projects, exact: true });
    },
  });
}

export function useDeleteProject() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (projectId: string) => {
      await getApiClient().deleteProject(projectId);
      return projectId;
    },
    onSuccess: (projectId) => {
      client.removeQueries({ queryKey: queryKeys.project(projectId) });
      client.removeQueries({ queryKey: ['sheets'], predicate: (q) => sheetQueryBelongsTo(q.state.data, projectId) });
      return client.invalidateQueries({ queryKey: queryKeys.projects, exact: true });
    },
  });
}

function sheetQueryBelongsTo(data: unknown, projectId: string): boolean {
  return (data as { sheet?: { projectId?: string } } | undefined)?.sheet?.projectId === projectId;
}

// Sheets

export function useSheets(projectId: string | undefined) {
  return useQuery({
    queryKey: queryKeys.sheets(projectId ?? ''),
    queryFn: async () => (await getApiClient().listSheets(projectId!)).sheets,
    enabled: !!projectId,
  });
}

export function useSheet(sheetId: string | undefined) {
  return useQuery({
    queryKey: queryKeys.sheet(sheetId ?? ''),
    queryFn: () => getApiClient().getSheet(sheetId!),
    enabled: !!sheetId,
  });
}

/** A sheet change alters its project's sheet list and the counts in the projects list. */
function invalidateSheetLists(client: QueryClient, projectId: string) {
  return Promise.all([
    client.invalidateQueries({ queryKey: queryKeys.sheets(projectId) }),
    client.invalidateQueries({ queryKey: queryKeys.project(projectId), exact: true }),
    client.invalidateQueries({ queryKey: queryKeys.projects, exact: true }),
  ]);
}

export function useCreateSheet(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: SheetCreateBody) => (await getApiClient().createSheet(projectId, body)).sheet,
    onSuccess: () => invalidateSheetLists(client, projectId),
  });
}

export function useRenameSheet(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async ({ sheetId, ...body }: SheetPatchBody & { sheetId: string }) =>
      (await getApiClient().renameSheet(sheetId, body)).sheet,
    onSuccess: (sheet) =>
      Promise.all([
        invalidateSheetLists(client, projectId),
        client.invalidateQueries({ queryKey: queryKeys.sheet(sheet.id) }),
      ]),
  });
}

export function useDeleteSheet(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (sheetId: string) => {
      await getApiClient().deleteSheet(sheetId);
      return sheetId;
    },
    onSuccess: (sheetId) => {
      client.removeQueries({ queryKey: queryKeys.sheet(sheetId) });
      return invalidateSheetLists(client, projectId);
    },
  });
}

// Members, server and mail

/** The server's health, which also says whether mail goes to the local outbox. */
export function useHealth() {
  return useQuery({ queryKey: queryKeys.health, queryFn: () => getApiClient().health(), staleTime: 5 * 60_000 });
}

export function useMembers(projectId: string | undefined) {
  return useQuery({
    queryKey: queryKeys.members(projectId ?? ''),
    queryFn: async () => (await getApiClient().listMembers(projectId!)).members,
    enabled: !!projectId,
  });
}

export function useOutbox() {
  return useQuery({
    queryKey: queryKeys.outbox,
    queryFn: async () => (await getApiClient().listOutbox()).messages,
    // New mail shows up by itself; a missing outbox (404) is final, so stop asking.
    refetchInterval: (query) => (query.state.status === 'error' ? false : 5_000),
  });
}

// Membership management (owners): roles, removal, invitations and the record of who did what.

/** A membership change alters the member list, the pending invitations and the activity record. */
function invalidateMembership(client: QueryClient, projectId: string) {
  return Promise.all([
    client.invalidateQueries({ queryKey: queryKeys.members(projectId) }),
    client.invalidateQueries({ queryKey: queryKeys.invitations(projectId) }),
    client.invalidateQueries({ queryKey: queryKeys.activity(projectId) }),
  ]);
}

export function useChangeMemberRole(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async ({ userId, role }: { userId: string; role: Role }) =>
      (await getApiClient().changeMemberRole(projectId, userId, role)).members,
    onSuccess: (members) => {
      client.setQueryData(queryKeys.members(projectId), members);
      return Promise.all([
        invalidateMembership(client, projectId),
        // The signed-in person may have changed their own role.
        client.invalidateQueries({ queryKey: queryKeys.project(projectId), exact: true }),
        client.invalidateQueries({ queryKey: queryKeys.projects, exact: true }),
      ]);
    },
  });
}

export function useRemoveMember(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => getApiClient().removeMember(projectId, userId),
    onSuccess: () => invalidateMembership(client, projectId),
  });
}

export function useInvitations(projectId: string | undefined, enabled = true) {
  return useQuery({
    queryKey: queryKeys.invitations(projectId ?? ''),
    queryFn: async () => (await getApiClient().listInvitations(projectId!)).invitations,
    enabled: !!projectId && enabled,
  });
}

export function useCreateInvitation(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: InvitationCreateBody) => (await getApiClient().createInvitation(projectId, body)).invitation,
    onSuccess: () => invalidateMembership(client, projectId),
  });
}

export function useResendInvitation(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (invitationId: string) => (await getApiClient().resendInvitation(projectId, invitationId)).invitation,
    onSuccess: () => invalidateMembership(client, projectId),
  });
}

export function useWithdrawInvitation(projectId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (invitationId: string) => (await getApiClient().withdrawInvitation(projectId, invitationId)).invitation,
    onSuccess: () => invalidateMembership(client, projectId),
  });
}

export function useActivity(projectId: string | undefined, enabled = true) {
  return useQuery({
    queryKey: queryKeys.activity(projectId ?? ''),
    queryFn: async () => (await getApiClient().listActivity(projectId!)).activity,
    enabled: !!projectId && enabled,
  });
}

// Invitations by token: readable without a session; accepting needs one.

export function useInvitationPreview(token: string | undefined) {
  return useQuery({
    queryKey: queryKeys.invitation(token ?? ''),
    queryFn: async () => (await getApiClient().getInvitation(token!)).invitation,
    enabled: !!token,
    // A 404 or 410 is the answer, not a hiccup.
    retry: false,
  });
}

export function useAcceptInvitation(token: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: () => getApiClient().acceptInvitation(token),
    onSuccess: ({ projectId }) =>
      Promise.all([
        client.invalidateQueries({ queryKey: queryKeys.projects, exact: true }),
        client.invalidateQueries({ queryKey: queryKeys.project(projectId) }),
      ]),
  });
}

// Viewer links (owners, per sheet).

export function useViewerLinks(sheetId: string | undefined) {
  return useQuery({
    queryKey: queryKeys.viewerLinks(sheetId ?? ''),
    queryFn: async () => (await getApiClient().listViewerLinks(sheetId!)).links,
    enabled: !!sheetId,
  });
}

export function useCreateViewerLink(sheetId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: ViewerLinkCreateBody) => getApiClient().createViewerLink(sheetId, body),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.viewerLinks(sheetId) }),
  });
}

export function useRevokeViewerLink(sheetId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (linkId: string) => (await getApiClient().revokeViewerLink(sheetId, linkId)).link,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.viewerLinks(sheetId) }),
  });
}

// The signed-in person's own preferences.

export function usePreferences() {
  return useQuery({
    queryKey: queryKeys.preferences,
    queryFn: async () => (await getApiClient().getPreferences()).preferences,
  });
}

export function useUpdatePreferences() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: Preferences) => (await getApiClient().updatePreferences(body)).preferences,
    onMutate: async (body) => {
      // The switch moves at once; a failure puts it back.
      await client.cancelQueries({ queryKey: queryKeys.preferences });
      const before = client.getQueryData<Preferences>(queryKeys.preferences);
      client.setQueryData(queryKeys.preferences, body);
      return { before };
    },
    onError: (_error, _body, context) => client.setQueryData(queryKeys.preferences, context?.before),
    onSuccess: (preferences) => client.setQueryData(queryKeys.preferences, preferences),
  });
}

// Revisions of a sheet: issued by editors and owners, reviewed by anyone who sees the sheet, restored by owners.

export function useRevisions(sheetId: string | undefined) {
  return useQuery({
    queryKey: queryKeys.revisions(sheetId ?? ''),
    queryFn: async () => (await getApiClient().listRevisions(sheetId!)).revisions,
    enabled: !!sheetId,
  });
}

export function useRevision(sheetId: string, number: number | null) {
  return useQuery({
    queryKey: queryKeys.revision(sheetId, number ?? 0),
    queryFn: async () => (await getApiClient().getRevision(sheetId, number!)).revision,
    enabled: !!sheetId && number !== null,
  });
}

/** Compared with the live sheet on request (it solves the live sheet on the server). */
export function useRevisionComparison(sheetId: string, number: number | null, enabled: boolean) {
  return useQuery({
    queryKey: queryKeys.comparison(sheetId, number ?? 0),
    queryFn: async () => (await getApiClient().compareRevision(sheetId, number!)).comparison,
    enabled: enabled && !!sheetId && number !== null,
    staleTime: 0,
  });
}

export function useIssueRevision(sheetId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: RevisionCreateBody) => (await getApiClient().issueRevision(sheetId, body)).revision,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.revisions(sheetId) }),
  });
}

export function useRestoreRevision(sheetId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (number: number) => getApiClient().restoreRevision(sheetId, number),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.revisions(sheetId) }),
  });
}

export function useReviewRevision(sheetId: string, number: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: ReviewCreateBody) => getApiClient().reviewRevision(sheetId, number, body),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.revisions(sheetId) }),
  });
}

// Revisions through a viewer link.

export function useLinkRevisions(token: string) {
  return useQuery({
    queryKey: queryKeys.linkRevisions(token),
    queryFn: async () => (await getApiClient().listLinkRevisions(token)).revisions,
    enabled: !!token,
    retry: false,
  });
}

export function useLinkComparison(token: string, number: number | null, enabled: boolean) {
  return useQuery({
    queryKey: queryKeys.linkComparison(token, number ?? 0),
    queryFn: async () => (await getApiClient().compareLinkRevision(token, number!)).comparison,
    enabled: enabled && !!token && number !== null,
    staleTime: 0,
  });
}

export function useLinkReview(token: string, number: number) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (body: ReviewCreateBody) => getApiClient().reviewLinkRevision(token, number, body),
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.linkRevisions(token) }),
  });
}
