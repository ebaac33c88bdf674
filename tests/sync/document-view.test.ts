// The JSON view is derived from the room's document; an import goes through the room as one transaction and
// reaches connected editors; an invalid import changes nothing; an old-format document is migrated on load.
import * as Y from 'yjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { validateSheet } from '../../shared/sheet';
import { createDocumentStore } from '../../server/sync/document-store';
import { docToJson } from '../../editor/document/sheet-doc';
import { connectSheet, eventually } from '../support/sync-client';
import { syncFixture, type SyncFixture } from '../support/sync-fixture';

let f: SyncFixture;
beforeAll(async () => {
  f = await syncFixture('view');
});
afterAll(() => f?.server.stop());

const smallService = (extraLoadKw = 1.2) => ({
  formatVersion: 1,
  name: 'Small service',
  settings: { frequencyHz: 60 },
  elements: {
    src: { kind: 'source', id: 'src', name: 'Utility', nominalVolts: 208 },
    main: { kind: 'bus', id: 'main', name: 'MDP', role: 'service', neutralGroundBond: true },
    lamp: { kind: 'load', id: 'lamp', name: 'Lamp', kw: extraLoadKw, ratedVolts: 120 },
  },
  connections: {
    c1: { id: 'c1', from: { elementId: 'src', terminal: 'out' }, to: { elementId: 'main', terminal: 'bars' }, conductorMap: { A: 'A', B: 'B', C: 'C', N: 'N' } },
    c2: { id: 'c2', from: { elementId: 'main', terminal: 'bars' }, to: { elementId: 'lamp', terminal: 'supply' }, conductorMap: { A: 'A', N: 'N' } },
  },
  whatIfs: {
    lostNeutral: { id: 'lostNeutral', name: 'Lamp neutral open', changes: { x: { kind: 'open-connection', connectionId: 'c2', conductor: 'N' } } },
  },
});

describe('the JSON view', () => {
  it('of a new sheet is an empty, valid sheet named after it', async () => {
    const r = await f.viewer.get(`/api/sheets/${f.sheetId}/document`);
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ formatVersion: 1, name: 'Service', elements: {}, connections: {}, whatIfs: {} });
    expect(validateSheet(r.body).ok).toBe(true);
  });

  it('an import is applied in the room, reaches a connected editor, and equals the document', async () => {
    const editor = connectSheet(f.editor, f.sheetId);
    await editor.synced();
    const put = await f.editor.request('PUT', `/api/sheets/${f.sheetId}/document`, smallService());
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    await eventually(() => editor.doc.getMap('elements').has('lamp'), 'import at the editor');
    const view = await f.viewer.get(`/api/sheets/${f.sheetId}/document`);
    expect(view.body).toEqual(docToJson(editor.doc, 'Service'));
    const valid = validateSheet(view.body);
    expect(valid.ok).toBe(true);
    expect(view.body.elements.lamp.kw).toBe(1.2);
    editor.destroy();
    const meta = await f.viewer.get(`/api/sheets/${f.sheetId}`);
    expect(meta.body.sheet.updatedBy.name).toBe('Editor view');
  });

  it('a second import changes only what differs, so an offline edit of another field merges with it', async () => {
    const editor = connectSheet(f.editor, f.sheetId);
    await editor.synced();
    editor.provider.disconnect();
    (editor.doc.getMap('elements').get('lamp') as Y.Map<unknown>).set('name', 'Porch lamp (edited offline)');
    const put = await f.owner.request('PUT', `/api/sheets/${f.sheetId}/document`, smallService(2.5));
    expect(put.status).toBe(200);
    editor.provider.connect();
    await eventually(() => (editor.doc.getMap('elements').get('lamp') as Y.Map<unknown>).get('kw') === 2.5, 'imported kW');
    const lampAt = async () => (await f.viewer.get(`/api/sheets/${f.sheetId}/document`)).body.elements.lamp;
    for (let i = 0; i < 100 && (await lampAt()).name !== 'Porch lamp (edited offline)'; i++) await new Promise((r) => setTimeout(r, 20));
    expect(await lampAt()).toMatchObject({ kw: 2.5, name: 'Porch lamp (edited offline)' });
    expect((editor.doc.getMap('elements').get('lamp') as Y.Map<unknown>).get('name')).toBe('Porch lamp (edited offline)');
    editor.destroy();
  });

  it('an invalid import is refused with paths and changes nothing', async () => {
    const before = (await f.owner.get(`/api/sheets/${f.sheetId}/document`)).body;
    const bad = smallService();
    (bad.elements.lamp as any).kw = -3;
    (bad.elements.src as any).nominalVolts = 'high';
    const r = await f.owner.request('PUT', `/api/sheets/${f.sheetId}/document`, bad);
    expect(r.status).toBe(400);
    const paths = r.body.error.issues.map((i: any) => i.path);
    expect(paths).toContain('body.elements.lamp.kw');
    expect(paths).toContain('body.elements.src.nominalVolts');
    expect(r.body.error.message).toMatch(/nothing was changed/);
    expect((await f.owner.get(`/api/sheets/${f.sheetId}/document`)).body).toEqual(before);
  });

  it('a viewer may read but not import', async () => {
    expect((await f.viewer.request('PUT', `/api/sheets/${f.sheetId}/document`, smallService())).status).toBe(403);
    expect((await f.outsider.get(`/api/sheets/${f.sheetId}/document`)).status).toBe(404);
  });
});

describe('old format versions', () => {
  it('are migrated when the room loads', async () => {
    const sheetId = (await f.owner.post(`/api/projects/${f.projectId}/sheets`, { name: 'Old' })).body.sheet.id;
    // A version 0 document stored before the format changed: its top-level fields sit in the "sheet" map.
    const old = new Y.Doc();
    old.getMap('sheet').set('version', 0);
    old.getMap('sheet').set('title', 'Draft barn feed');
    old.getMap('sheet').set('items', [
      { id: 'util', type: 'source', kv: 0.24 },
      { id: 'barn', type: 'panel', phases: 'ABN', service: true },
    ]);
    old.getMap('sheet').set('wires', [{ id: 'w1', a: 'util/out', b: 'barn/bus', phases: 'ABN' }]);
    await createDocumentStore(f.server.database.db).append(sheetId, [{ update: Y.encodeStateAsUpdate(old), userId: null }]);
    const view = await f.owner.get(`/api/sheets/${sheetId}/document`);
    expect(view.status).toBe(200);
    expect(view.body.formatVersion).toBe(1);
    expect(view.body.name).toBe('Old'); // the sheet list's name: the old document's own title is not kept
    expect(view.body.elements.barn).toMatchObject({ kind: 'bus', role: 'service', phaseC: false });
    expect(view.body.connections.w1.to).toEqual({ elementId: 'barn', terminal: 'bars' });
    expect(view.body.items).toBeUndefined();
    expect(validateSheet(view.body).ok).toBe(true);
  });
});

describe('a new sheet', () => {
  it('starts from an empty document that carries the current format version', async () => {
    const sheetId = (await f.owner.post(`/api/projects/${f.projectId}/sheets`, { name: 'Fresh' })).body.sheet.id;
    const editor = connectSheet(f.editor, sheetId);
    await editor.synced();
    await eventually(() => editor.doc.getMap('sheet').get('formatVersion') === 1, 'format version in the document');
    expect(editor.doc.getMap('elements').size).toBe(0);
    editor.destroy();
  });
});
