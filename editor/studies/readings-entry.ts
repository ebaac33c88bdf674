// The readings a person gives the readings match: one entry per measured point (a load, or two bars of a bus),
// added by tapping the element on the drawing or pasted as CSV. Checked here with a clear word per bad line
// before anything is run; nothing is half-read.
import type { ConductorId } from '../../shared/sheet';
import type { Reading, ReadingPoint } from '../../solver';

export interface ReadingEntry {
  /** Stable within the list (for keys and removal). */
  id: string;
  point: ReadingPoint;
  /** Where it was taken, in words: "Apartment 4 lights A–N", "Service A–N". */
  where: string;
  /** As typed; checked when the match runs. */
  voltsText: string;
}

export interface NamedElement {
  id: string;
  name: string;
  kind: string;
}

const CONDUCTORS: readonly string[] = ['A', 'B', 'C', 'N', 'PE'];

/** The point of a reading at an element: a load across its first element, a bus phase A to neutral (or to earth). */
export function pointAt(element: NamedElement, busBars?: { neutral: boolean }): ReadingPoint | null {
  if (element.kind === 'load') return { kind: 'load', loadId: element.id };
  if (element.kind === 'bus') return { kind: 'bus', busId: element.id, from: 'A', to: busBars?.neutral === false ? 'earth' : 'N' };
  return null;
}

export function pointWords(point: ReadingPoint, nameOf: (id: string) => string): string {
  if (point.kind === 'load') return `${nameOf(point.loadId)}${point.element ? ` ${point.element}` : ''}`;
  return `${nameOf(point.busId)} ${point.from}–${point.to === 'earth' ? 'earth' : point.to}`;
}

export interface CsvProblem {
  line: number;
  message: string;
}

/**
 * Reads pasted lines of `where, volts[, across]`: `where` is a load's or bus's name or id; `across` is a load's
 * element ("A–N", "A-B") or a bus's two bars ("A-N", "B-earth"). A first line without a number is taken as a
 * header. Commas, semicolons or tabs separate; a name holding one goes in double quotes. Any bad line: no entries at all, every problem with its line.
 */
export function parseReadingsCsv(text: string, elements: readonly NamedElement[], nextId: () => string): { ok: true; entries: ReadingEntry[] } | { ok: false; problems: CsvProblem[] } {
  const byName = new Map<string, NamedElement[]>();
  for (const e of elements) {
    if (e.kind !== 'load' && e.kind !== 'bus') continue;
    for (const key of new Set([e.id.toLowerCase(), e.name.trim().toLowerCase()])) if (key) byName.set(key, [...(byName.get(key) ?? []), e]);
  }
  const nameOf = (id: string) => elements.find((e) => e.id === id)?.name || id;
  const entries: ReadingEntry[] = [];
  const problems: CsvProblem[] = [];
  const lines = text.split(/\r?\n/);
  lines.forEach((raw, i) => {
    const line = i + 1;
    if (!raw.trim() || raw.trim().startsWith('#')) return;
    const cells = splitCells(raw);
    const voltsCell = (cells[1] ?? '').replace(/\s*v$/i, '');
    const volts = Number(voltsCell);
    if (entries.length === 0 && problems.length === 0 && i === lines.findIndex((l) => l.trim()) && !Number.isFinite(volts)) return; // a header
    if (cells.length < 2 || !cells[0]) {
      problems.push({ line, message: 'expected "where, volts" (a load or bus name, then the voltage)' });
      return;
    }
    if (!voltsCell || !Number.isFinite(volts) || volts <= 0) {
      problems.push({ line, message: `"${cells[1] ?? ''}" is not a voltage (a number of volts above 0)` });
      return;
    }
    const found = byName.get(cells[0].toLowerCase()) ?? [];
    if (found.length === 0) {
      problems.push({ line, message: `no load or bus is called "${cells[0]}"` });
      return;
    }
    if (found.length > 1) {
      problems.push({ line, message: `"${cells[0]}" names ${found.length} elements: use an id (${found.map((f) => f.id).join(', ')})` });
      return;
    }
    const element = found[0];
    const across = (cells[2] ?? '').replace(/[–—]/g, '-').toUpperCase();
    let point: ReadingPoint;
    if (element.kind === 'load') {
      point = { kind: 'load', loadId: element.id, ...(across ? { element: across.replace('-', '–') } : {}) };
    } else {
      const [from, to] = across ? across.split('-').map((c) => c.trim()) : ['A', 'N'];
      const toOk = to === 'EARTH' || CONDUCTORS.includes(to);
      if (!CONDUCTORS.includes(from) || !toOk) {
        problems.push({ line, message: `"${cells[2]}" is not two bars of a bus (for example A-N, B-C or A-earth)` });
        return;
      }
      point = { kind: 'bus', busId: element.id, from: from as ConductorId, to: to === 'EARTH' ? 'earth' : (to as ConductorId) };
    }
    entries.push({ id: nextId(), point, where: pointWords(point, nameOf), voltsText: String(volts) });
  });
  if (problems.length) return { ok: false, problems };
  if (entries.length === 0) return { ok: false, problems: [{ line: 1, message: 'no readings found: one line per reading, "where, volts"' }] };
  return { ok: true, entries };
}

/** One line's cells: separated by commas, semicolons or tabs; a cell in double quotes may hold them ("Service, 400 A"). */
export function splitCells(line: string): string[] {
  const cells: string[] = [];
  let cell = '';
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quoted) {
      if (ch === '"' && line[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (ch === '"') quoted = false;
      else cell += ch;
    } else if (ch === '"' && !cell.trim()) quoted = true;
    else if (ch === ',' || ch === ';' || ch === '\t') {
      cells.push(cell.trim());
      cell = '';
    } else cell += ch;
  }
  cells.push(cell.trim());
  return cells;
}

/** The entries as readings for the solver, or the problems (each entry named) if any voltage is not a number. */
export function toReadings(entries: readonly ReadingEntry[]): { ok: true; readings: Reading[] } | { ok: false; problems: string[] } {
  const problems: string[] = [];
  const readings: Reading[] = [];
  for (const e of entries) {
    const volts = Number(e.voltsText.trim().replace(/\s*v$/i, ''));
    if (!e.voltsText.trim() || !Number.isFinite(volts) || volts <= 0) problems.push(`${e.where}: "${e.voltsText}" is not a voltage above 0`);
    else readings.push({ at: e.point, volts });
  }
  if (entries.length === 0) problems.push('add at least one reading: tap a load or bus on the drawing, or paste CSV');
  return problems.length ? { ok: false, problems } : { ok: true, readings };
}
