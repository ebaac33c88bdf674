// A server with one project, one sheet and four people: owner, editor, viewer (members) and an outsider.
import { projectMember } from '../../db/schema';
import { startTestServer, type TestServer } from './test-server';
import { TestClient } from './http-client';

export interface SyncFixture {
  server: TestServer;
  owner: TestClient;
  editor: TestClient;
  viewer: TestClient;
  outsider: TestClient;
  ids: Record<'owner' | 'editor' | 'viewer' | 'outsider', string>;
  projectId: string;
  sheetId: string;
}

export async function syncFixture(tag: string, env: Record<string, string> = {}): Promise<SyncFixture> {
  const server = await startTestServer(env);
  const people = { owner: new TestClient(server.url), editor: new TestClient(server.url), viewer: new TestClient(server.url), outsider: new TestClient(server.url) };
  const ids = {} as SyncFixture['ids'];
  for (const [who, c] of Object.entries(people)) {
    ids[who as keyof typeof ids] = (await c.signUp(`${who}-${tag}@example.com`, 'correct-horse-battery', `${who[0].toUpperCase()}${who.slice(1)} ${tag}`)).id;
  }
  const projectId = (await people.owner.post('/api/projects', { name: `Sync ${tag}` })).body.project.id;
  await server.database.db.insert(projectMember).values([
    { projectId, userId: ids.editor, role: 'editor' },
    { projectId, userId: ids.viewer, role: 'viewer' },
  ]);
  const sheetId = (await people.owner.post(`/api/projects/${projectId}/sheets`, { name: 'Service' })).body.sheet.id;
  return { server, ...people, ids, projectId, sheetId };
}
