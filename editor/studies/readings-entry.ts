// The readings a person gives the readings match: one entry per measured point (a load, or two bars of a bus),
// added by tapping the element on the drawing (then choosing the bars or load element it is across) or pasted as
// CSV. Checked here with a clear word per bad line before anything is run; nothing is half-read.
import type { ConductorId, Sheet } from '../../shared/sheet';
import type { Reading, ReadingPoint } from '../../solver';
import { acrossAt, acrossKey, acrossLabel, defaultPointAt, findAcross, type AcrossGroup } from './reading-across';

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

export function pointWords(point: ReadingPoint, nameOf: (id: string) => string): string {
  if (point.kind === 'load') return `${nameOf(point.loadId)}${point.element ? ` ${point.element}` : ''}`;
  return `${nameOf(point.busId)} ${point.from}–${point.to === 'earth' ? 'earth' : point.to}`;
}

/** The entry across another pair of bars (or load element): its point and its words. */
export function withPoint(entry: ReadingEntry, point: ReadingPoint, nameOf: (id: string) => string): ReadingEntry {
  return { ...entry, point, where: pointWords(point, nameOf) };
}

/** An entry as the form shows it: what it may be across at its element now, which of those it is, or why none. */
export interface ReadingRow {
  entry: ReadingEntry;
  /** The element's name, for the chips' spoken labels ("Apartment 4"). */
  at: string;
  /** Empty for a load of one element (nothing to choose). */
  across: AcrossGroup[];
  /** The chosen key among `across` ("B-N", "A–B"). */
  chosen: string;
  /** The element no longer has the chosen bars (or is gone): say so beside the entry. */
  problem: string | null;
}

const elementIdOf = (point: ReadingPoint): string => (point.kind === 'bus' ? point.busId : point.loadId);

export function readingRows(entries: readonly ReadingEntry[], elements: Sheet['elements'] | null): ReadingRow[] {
  return entries.map((entry) => {
    const id = elementIdOf(entry.point);
    const element = elements?.[id];
    if (!elements) return { entry, at: id, across: [], chosen: acrossKey(entry.point), problem: null };
    if (!element || element.kind !== entry.point.kind) return { entry, at: id, across: [], chosen: '', problem: `no ${entry.point.kind} "${id}" on the sheet now` };
    const at = element.name || id;
    const across = acrossAt(element);
    // A load's reading without a named element is across its first.
    const point = entry.point.kind === 'load' && entry.point.element === undefined ? defaultPointAt(element) ?? entry.point : entry.point;
    const found = across.length === 0 || findAcross(across, point);
    const words = entry.point.kind === 'bus' ? `${at} has no ${acrossLabel(entry.point)} now: choose the bars again` : `${at} has no element ${acrossKey(point)} now: choose again`;
    return { entry, at, across, chosen: acrossKey(point), problem: found ? null : words };
  });
}

/** The entries with one put across another choice its own element offers (anything else changes nothing). */
export function chooseAcross(entries: readonly ReadingEntry[], id: string, key: string, elements: Sheet['elements'], nameOf: (id: string) => string): ReadingEntry[] {
  return entries.map((e) => {
    if (e.id !== id) return e;
    const element = elements[elementIdOf(e.point)];
    const choice = element ? acrossAt(element).flatMap((g) => g.choices).find((c) => c.key === key) : undefined;
    return choice ? withPoint(e, choice.point, nameOf) : e;
  });
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
