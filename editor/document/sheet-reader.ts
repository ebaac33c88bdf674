// Turns the mirror into a validated sheet for the solver, re-validating only the entries that changed (each entry
// keeps its parse while its plain object keeps its identity). Entries that fail their schema are left out of the
// solve and reported, with the field and the message, so the drawing can mark them.
import type { z } from 'zod';
import {
  connectionSchema,
  elementSchema,
  findReferenceProblems,
  issuesFromZod,
  settingsSchema,
  SHEET_FORMAT_VERSION,
  whatIfSchema,
  type Connection,
  type Sheet,
  type SheetElement,
  type SheetIssue,
  type WhatIf,
} from '../../shared/sheet';
import type { MirrorSnapshot } from './sheet-mirror';

export interface ReadSnapshot {
  sheet: Sheet;
  /** Entries left out because they fail their schema. */
  invalid: SheetIssue[];
  /** Dangling references (concurrent deletes): the solver skips them and says so. */
  warnings: SheetIssue[];
}

type Parsed<T> = { ok: true; value: T } | { ok: false; issues: SheetIssue[] };

class EntryCache<T> {
  private cache = new Map<string, { source: unknown; parsed: Parsed<T> }>();

  constructor(
    private readonly schema: z.ZodType<T>,
    private readonly group: 'elements' | 'connections' | 'whatIfs',
  ) {}

  read(entries: ReadonlyMap<string, unknown>): { values: Record<string, T>; invalid: SheetIssue[] } {
    const values: Record<string, T> = {};
    const invalid: SheetIssue[] = [];
    const next = new Map<string, { source: unknown; parsed: Parsed<T> }>();
    for (const [id, source] of entries) {
      let hit = this.cache.get(id);
      if (!hit || hit.source !== source) {
        const r = this.schema.safeParse(source);
        hit = { source, parsed: r.success ? { ok: true, value: r.data } : { ok: false, issues: issuesFromZod(r.error, [this.group, id]) } };
      }
      next.set(id, hit);
      if (hit.parsed.ok) values[id] = hit.parsed.value;
      else invalid.push(...hit.parsed.issues);
    }
    this.cache = next;
    return { values, invalid };
  }
}

export class SheetReader {
  private readonly elements = new EntryCache<SheetElement>(elementSchema as unknown as z.ZodType<SheetElement>, 'elements');
  private readonly connections = new EntryCache<Connection>(connectionSchema as unknown as z.ZodType<Connection>, 'connections');
  private readonly whatIfs = new EntryCache<WhatIf>(whatIfSchema as unknown as z.ZodType<WhatIf>, 'whatIfs');
  private settingsSource: unknown;
  private settings: { value: Sheet['settings']; invalid: SheetIssue[] } | undefined;
  private last: { snapshot: MirrorSnapshot; read: ReadSnapshot } | undefined;

  read(snapshot: MirrorSnapshot): ReadSnapshot {
    if (this.last?.snapshot === snapshot) return this.last.read;
    const elements = this.elements.read(snapshot.elements);
    const connections = this.connections.read(snapshot.connections);
    const whatIfs = this.whatIfs.read(snapshot.whatIfs);
    if (!this.settings || this.settingsSource !== snapshot.settings) {
      this.settingsSource = snapshot.settings;
      const r = settingsSchema.safeParse(snapshot.settings);
      this.settings = r.success
        ? { value: r.data, invalid: [] }
        : { value: settingsSchema.parse({}), invalid: issuesFromZod(r.error, ['settings']) };
    }
    const sheet: Sheet = {
      formatVersion: SHEET_FORMAT_VERSION,
      name: '', // the sheet list holds the name; solving does not need it
      settings: this.settings.value,
      elements: elements.values,
      connections: connections.values,
      whatIfs: whatIfs.values,
    };
    const read: ReadSnapshot = {
      sheet,
      invalid: [...this.settings.invalid, ...elements.invalid, ...connections.invalid, ...whatIfs.invalid],
      warnings: findReferenceProblems(sheet),
    };
    this.last = { snapshot, read };
    return read;
  }
}
