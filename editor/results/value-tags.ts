// The mapping of a solve's results onto the drawing: value tags (number, unit, standing) stacked at each element's
// tag anchor, the live state of each element, and the conductors the solve had open. The canvas draws exactly
// this, and the tests check it on the demo sheets, so what is tested is what is shown.
import type { ConductorId, Sheet, SheetElement } from '../../shared/sheet';
import { placeText, symbolOf, TAG_PITCH, type TextAlign } from '../../shared/symbols';
import type { BusResult, LoadResult, RunResult, SolveResult, Standing } from '../../solver';

/** A tag's standing: against the voltage standard (or ampacity for currents); plain where none applies. */
export type TagStanding = 'normal' | 'tolerable' | 'outside' | 'plain';

export interface ValueTag {
  /** Stable across solves: `${elementId}:${what}`. */
  key: string;
  elementId: string;
  /** What it measures, short: "A–N", "N–G", "N". */
  label: string;
  value: number;
  /** The number as drawn (tabular figures), without the unit. */
  text: string;
  unit: 'V' | 'A';
  standing: TagStanding;
  /** Said to screen readers and shown in the results panel: "Café lights A–N 118.2 V, within ANSI C84.1 Range A". */
  description: string;
}

export interface TagStack {
  elementId: string;
  x: number;
  y: number;
  align: TextAlign;
  tags: ValueTag[];
}

export type DrawnState = 'energised' | 'back-fed' | 'de-energised' | 'partly-energised';

export interface ElementStatus {
  state: DrawnState;
  ungrounded: boolean;
  /** A live bus with conductors live only through loads (a lost neutral): those conductors, "N". */
  backFed?: string;
}

export interface DrawnResults {
  stacks: TagStack[];
  /** Every tag by key, for lookups (differences, tests). */
  tags: Map<string, ValueTag>;
  status: Map<string, ElementStatus>;
  /** "runId|conductor" opened in this solve (in the sheet, the what-if or a trial). */
  openConductors: Set<string>;
  standard: { id: string; label: string };
}

const PHASES = ['A', 'B', 'C'] as const;

export function formatVolts(v: number): string {
  return Math.abs(v) >= 1000 ? v.toFixed(0) : v.toFixed(1);
}

export function formatAmperes(a: number): string {
  return Math.abs(a) >= 1000 ? a.toFixed(0) : Math.abs(a) >= 100 ? a.toFixed(0) : a.toFixed(1);
}

function fromStanding(s: Standing | undefined): TagStanding {
  return s ? s.standing : 'plain';
}

const STANDING_WORDS: Record<TagStanding, string> = {
  normal: 'within the normal range',
  tolerable: 'outside the normal range but within the tolerable one',
  outside: 'outside both ranges',
  plain: '',
};

function tag(element: SheetElement, what: string, label: string, value: number, unit: 'V' | 'A', standing: TagStanding, extra = ''): ValueTag {
  const text = unit === 'V' ? formatVolts(value) : formatAmperes(value);
  const name = element.name || element.id;
  const words = STANDING_WORDS[standing];
  return {
    key: `${element.id}:${what}`,
    elementId: element.id,
    label,
    value,
    text,
    unit,
    standing,
    description: `${name} ${label} ${text} ${unit}${words ? `, ${words}` : ''}${extra}`,
  };
}

function busTags(element: SheetElement, bus: BusResult): ValueTag[] {
  if (bus.state === 'de-energised') return [];
  const out: ValueTag[] = [];
  const hasNeutral = bus.neutralToGroundVolts !== null || Object.keys(bus.lineToNeutralVolts).length > 0;
  if (hasNeutral) {
    for (const p of PHASES) {
      const v = bus.lineToNeutralVolts[p];
      if (v === undefined) continue;
      out.push(tag(element, `ln-${p}`, `${p}–N`, v, 'V', fromStanding(bus.standing.lineToNeutral[p])));
    }
    if (bus.neutralToGroundVolts !== null) out.push(tag(element, 'ng', 'N–G', bus.neutralToGroundVolts, 'V', 'plain'));
  } else {
    for (const pair of ['AB', 'BC', 'CA'] as const) {
      const v = bus.lineToLineVolts[pair];
      if (v === undefined) continue;
      out.push(tag(element, `ll-${pair}`, `${pair[0]}–${pair[1]}`, v, 'V', fromStanding(bus.standing.lineToLine[pair])));
    }
  }
  return out;
}

/**
 * The bus conductors a load's own terminals land on (a line-to-neutral load's A may sit on the bus's B), so its
 * tags name the phase it is really on.
 */
function supplyLandings(sheet: Sheet): Map<string, Partial<Record<string, string>>> {
  const out = new Map<string, Partial<Record<string, string>>>();
  for (const c of Object.values(sheet.connections)) {
    if (c.to.terminal === 'supply' && !out.has(c.to.elementId)) {
      out.set(c.to.elementId, Object.fromEntries(Object.entries(c.conductorMap).map(([from, to]) => [to, from])));
    }
    if (c.from.terminal === 'supply' && !out.has(c.from.elementId)) out.set(c.from.elementId, { ...c.conductorMap });
  }
  return out;
}

function loadTags(landings: Map<string, Partial<Record<string, string>>>, element: SheetElement, load: LoadResult): ValueTag[] {
  if (load.state === 'de-energised') return [];
  const landing = landings.get(element.id) ?? {};
  return load.elements.map((e, i) => {
    const extra = e.constantImpedanceVolts !== undefined ? `; ${formatVolts(e.constantImpedanceVolts)} V if every load were constant impedance` : '';
    const what = load.elements.length === 1 ? 'v' : `v-${i}`;
    const label = e.label.replace(/\b(A|B|C|N)\b/g, (c) => landing[c] ?? c);
    return tag(element, what, label, e.volts, 'V', fromStanding(e.standing), extra);
  });
}

function runTags(element: SheetElement, run: RunResult): ValueTag[] {
  const order: ConductorId[] = ['A', 'B', 'C', 'N', 'PE'];
  const out: ValueTag[] = [];
  for (const c of order) {
    const k = run.conductors[c];
    if (!k) continue;
    const over = k.percentOfAmpacity !== undefined && k.percentOfAmpacity > 100;
    const extra = k.open ? ' (open)' : k.percentOfAmpacity !== undefined ? `, ${k.percentOfAmpacity.toFixed(0)} % of its ampacity` : '';
    out.push(tag(element, `i-${c}`, c, k.current.magnitude, 'A', over ? 'outside' : 'plain', extra));
  }
  return out;
}

// Statuses are shared objects (a handful of combinations), so a drawing that did not change state is not redrawn.
const STATUSES = new Map<string, ElementStatus>();
function statusOf(state: DrawnState, ungrounded: boolean, backFed = ''): ElementStatus {
  const key = `${state}|${ungrounded}|${backFed}`;
  let s = STATUSES.get(key);
  if (!s) STATUSES.set(key, (s = backFed ? { state, ungrounded, backFed } : { state, ungrounded }));
  return s;
}

/** A bus whose phases are live but some conductor is live only through loads is a hazard, drawn as back-fed. */
function busStatus(bus: BusResult): ElementStatus {
  const backFed = (Object.entries(bus.conductors) as [string, { state?: string } | undefined][]).filter(([, k]) => k?.state === 'back-fed').map(([c]) => c);
  if (bus.state === 'energised' && backFed.length) return statusOf('back-fed', bus.ungrounded, backFed.join(' '));
  return statusOf(bus.state, bus.ungrounded);
}

const sameTags = (a: ValueTag[], b: ValueTag[]) =>
  a.length === b.length && a.every((t, i) => t.key === b[i].key && t.text === b[i].text && t.label === b[i].label && t.standing === b[i].standing && t.description === b[i].description);

/**
 * Keeps the previous solve's stack objects where nothing drawn changed (same place, same texts and standings),
 * so the canvas redraws only the tags whose figures moved.
 */
export function reuseUnchanged(previous: DrawnResults | null, next: DrawnResults): DrawnResults {
  if (!previous) return next;
  const old = new Map(previous.stacks.map((s) => [s.elementId, s]));
  let reused = 0;
  const stacks = next.stacks.map((s) => {
    const p = old.get(s.elementId);
    if (p && p.x === s.x && p.y === s.y && p.align === s.align && sameTags(p.tags, s.tags)) {
      reused++;
      return p;
    }
    return s;
  });
  if (reused === 0) return next;
  const tags = new Map<string, ValueTag>();
  for (const s of stacks) for (const t of s.tags) tags.set(t.key, t);
  return { ...next, stacks, tags };
}

export function drawnResults(sheet: Sheet, result: SolveResult): DrawnResults {
  const stacks: TagStack[] = [];
  const tags = new Map<string, ValueTag>();
  const status = new Map<string, ElementStatus>();
  const openConductors = new Set<string>();
  const place = (element: SheetElement, list: ValueTag[]) => {
    if (list.length === 0) return;
    const anchor = placeText(element, symbolOf(element).tags);
    stacks.push({ elementId: element.id, x: anchor.x, y: anchor.y, align: anchor.align, tags: list });
    for (const t of list) tags.set(t.key, t);
  };
  for (const bus of result.buses) {
    const element = sheet.elements[bus.busId];
    if (!element) continue;
    status.set(bus.busId, busStatus(bus));
    place(element, busTags(element, bus));
  }
  const landings = supplyLandings(sheet);
  for (const load of result.loads) {
    const element = sheet.elements[load.loadId];
    if (!element) continue;
    status.set(load.loadId, statusOf(load.state, false));
    place(element, loadTags(landings, element, load));
  }
  for (const run of result.runs) {
    const element = sheet.elements[run.runId];
    if (!element) continue;
    for (const [c, k] of Object.entries(run.conductors)) if (k?.open) openConductors.add(`${run.runId}|${c}`);
    place(element, runTags(element, run));
  }
  return { stacks, tags, status, openConductors, standard: result.standard };
}

/** Where the n-th tag of a stack sits (tags stack downward from the anchor). */
export function tagOffset(index: number): number {
  return index * TAG_PITCH;
}
