// The sheet's commands: each one is one Yjs transaction carrying the caller's origin, so undo tracks only the
// caller's own edits and listeners can tell local from remote changes.
import * as Y from 'yjs';
import type { z } from 'zod';
import type { Connection, elementSchema, Sheet, SheetSettings, WhatIfChange } from '../../shared/sheet';
import { newId } from './ids';
import { collection, settingsMap, writeSheet, type Collection } from './sheet-doc';
import { fromY, setAtPath, toY, type Plain } from './y-values';

type WithOptionalId<T> = T extends unknown ? Omit<T, 'id'> & { id?: string } : never;
type ElementInput = z.input<typeof elementSchema>;
/** An element as written: any of its fields (defaults fill the rest when read), the kind required. */
export type NewElement = WithOptionalId<Partial<ElementInput> & Pick<ElementInput, 'kind'>> & Record<string, unknown>;
export type NewConnection = Omit<Connection, 'id'> & { id?: string };
/** Field writes to one entry of the document (several entries change together in one edit of a schedule row). */
export interface EntryEdit {
  where: Collection;
  id: string;
  changes: readonly { path: readonly string[]; value: Plain | undefined }[];
}

const plain = (v: unknown) => JSON.parse(JSON.stringify(v)) as Record<string, Plain>;

export class SheetCommands {
  constructor(
    readonly doc: Y.Doc,
    readonly origin: object = {},
  ) {}

  private run<T>(edit: () => T): T {
    let out!: T;
    this.doc.transact(() => {
      out = edit();
    }, this.origin);
    return out;
  }

  setSetting<K extends keyof SheetSettings>(key: K, value: SheetSettings[K]): void {
    this.run(() => settingsMap(this.doc).set(key, value as unknown));
  }

  addElement(element: NewElement): string {
    const id = element.id ?? newId(element.kind);
    this.run(() => collection(this.doc, 'elements').set(id, toY({ ...plain(element), id }) as Y.Map<unknown>));
    return id;
  }

  /** Moves several elements in one transaction (the end of one drag). */
  moveElements(moves: { id: string; x: number; y: number }[]): void {
    this.run(() => {
      const elements = collection(this.doc, 'elements');
      for (const m of moves) {
        const el = elements.get(m.id);
        if (!el) continue; // deleted meanwhile by a colleague
        el.set('x', m.x);
        el.set('y', m.y);
      }
    });
  }

  /** Several fields of one entry in one transaction (one inspector save is one undo step). */
  updateFields(where: Collection, id: string, changes: readonly { path: readonly string[]; value: Plain | undefined }[]): boolean {
    if (changes.length === 0) return false;
    return this.run(() => {
      const entry = collection(this.doc, where).get(id);
      if (!entry) return false;
      for (const { path, value } of changes) {
        if (path.length === 0 || path[0] === 'id') continue;
        setAtPath(entry, path, value);
      }
      return true;
    });
  }

  /** Field writes to several entries in one transaction (one schedule row edits its load, breaker and feed). */
  updateEntries(edits: readonly EntryEdit[]): boolean {
    if (edits.every((e) => e.changes.length === 0)) return false;
    return this.run(() => {
      let any = false;
      for (const edit of edits) {
        const entry = collection(this.doc, edit.where).get(edit.id);
        if (!entry) continue; // deleted meanwhile by a colleague
        for (const { path, value } of edit.changes) {
          if (path.length === 0 || path[0] === 'id') continue;
          setAtPath(entry, path, value);
          any = true;
        }
      }
      return any;
    });
  }

  /** Adds elements and the connections between them (and to existing elements) in one transaction. */
  insertEntries(entries: { elements: (NewElement & { id: string })[]; connections: (NewConnection & { id: string })[] }): void {
    this.run(() => {
      const elements = collection(this.doc, 'elements');
      for (const e of entries.elements) elements.set(e.id, toY(plain(e)) as Y.Map<unknown>);
      const connections = collection(this.doc, 'connections');
      for (const c of entries.connections) connections.set(c.id, toY(plain(c)) as Y.Map<unknown>);
    });
  }

  /** Makes the document hold a whole sheet (an import), in one transaction; only what differs is written. */
  replaceSheet(sheet: Sheet): void {
    this.run(() => writeSheet(this.doc, sheet));
  }

  /** Turns elements by a quarter turn (or any multiple) about their own centres, in one transaction. */
  rotateElements(ids: readonly string[], deltaDeg = 90): void {
    this.run(() => {
      const elements = collection(this.doc, 'elements');
      for (const id of ids) {
        const el = elements.get(id);
        if (!el) continue;
        const current = Number(el.get('rotationDeg') ?? 0);
        const next = ((((Number.isFinite(current) ? current : 0) + deltaDeg) % 360) + 360) % 360;
        el.set('rotationDeg', next);
      }
    });
  }

  /**
   * Copies elements (and the connections between two copied elements) offset by dx, dy, in one transaction.
   * Returns the new ids in the order given.
   */
  duplicateElements(ids: readonly string[], offset: { dx: number; dy: number }): string[] {
    return this.run(() => {
      const elements = collection(this.doc, 'elements');
      const renamed = new Map<string, string>();
      for (const id of ids) {
        const el = elements.get(id);
        if (!el) continue;
        const json = fromY(el) as Record<string, Plain>;
        const copyId = newId(String(json.kind ?? 'element'));
        renamed.set(id, copyId);
        const x = Number(json.x ?? 0) + offset.dx;
        const y = Number(json.y ?? 0) + offset.dy;
        elements.set(copyId, toY({ ...json, id: copyId, x, y }) as Y.Map<unknown>);
      }
      const connections = collection(this.doc, 'connections');
      for (const c of [...connections.values()]) {
        const json = fromY(c) as { from?: { elementId?: string }; to?: { elementId?: string } } & Record<string, Plain>;
        const from = renamed.get(String(json.from?.elementId));
        const to = renamed.get(String(json.to?.elementId));
        if (!from || !to) continue;
        const copyId = newId('conn');
        const fromEnd = json.from as Record<string, Plain>;
        const toEnd = json.to as Record<string, Plain>;
        connections.set(copyId, toY({ ...json, id: copyId, from: { ...fromEnd, elementId: from }, to: { ...toEnd, elementId: to } }) as Y.Map<unknown>);
      }
      return ids.flatMap((id) => (renamed.has(id) ? [renamed.get(id)!] : []));
    });
  }

  /** Sets one field (a path of keys, e.g. ['conductors', 'N', 'open']) of an element, connection or what-if. */
  setField(where: Collection, id: string, path: readonly string[], value: Plain | undefined): boolean {
    return this.run(() => {
      const entry = collection(this.doc, where).get(id);
      if (!entry || path.length === 0 || path[0] === 'id') return false;
      setAtPath(entry, path, value);
      return true;
    });
  }

  /** Deletes elements and every connection that lands on them. What-if changes that name them are left to readers. */
  deleteElements(ids: readonly string[]): void {
    const gone = new Set(ids);
    this.run(() => {
      const elements = collection(this.doc, 'elements');
      for (const id of ids) elements.delete(id);
      const connections = collection(this.doc, 'connections');
      for (const [cid, c] of [...connections.entries()]) {
        const from = (c.get('from') as Y.Map<unknown> | undefined)?.get('elementId');
        const to = (c.get('to') as Y.Map<unknown> | undefined)?.get('elementId');
        if (gone.has(from as string) || gone.has(to as string)) connections.delete(cid);
      }
    });
  }

  connect(connection: NewConnection): string {
    const id = connection.id ?? newId('conn');
    this.run(() => collection(this.doc, 'connections').set(id, toY({ ...plain(connection), id }) as Y.Map<unknown>));
    return id;
  }

  disconnect(connectionId: string): void {
    this.run(() => collection(this.doc, 'connections').delete(connectionId));
  }

  addWhatIf(name: string, id = newId('whatif')): string {
    this.run(() => collection(this.doc, 'whatIfs').set(id, toY({ id, name, changes: {} }) as Y.Map<unknown>));
    return id;
  }

  removeWhatIf(id: string): void {
    this.run(() => collection(this.doc, 'whatIfs').delete(id));
  }

  addChange(whatIfId: string, change: WhatIfChange, changeId = newId('change')): string | null {
    return this.run(() => {
      const w = collection(this.doc, 'whatIfs').get(whatIfId);
      if (!w) return null;
      setAtPath(w, ['changes', changeId], plain(change));
      return changeId;
    });
  }

  removeChange(whatIfId: string, changeId: string): void {
    this.run(() => {
      const changes = collection(this.doc, 'whatIfs').get(whatIfId)?.get('changes');
      if (changes instanceof Y.Map) changes.delete(changeId);
    });
  }
}
