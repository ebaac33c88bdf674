// What a field reading can be across at the element tapped: two bars the bus really has (grouped the way a meter
// is put on: to neutral, between phases, to the ground bar, to remote earth) or one element of a load with more
// than one. The solver's ReadingPoint takes any two bars of a bus (`to` may be 'earth') and a load's element label.
import { terminalConductors, type ConductorId, type PhaseId, type SheetElement } from '../../shared/sheet';
import { loadElementLabels, type ReadingPoint } from '../../solver';

export type AcrossGroupKind = 'neutral' | 'phases' | 'ground' | 'earth' | 'element';

export interface AcrossChoice {
  /** "B-N", "A-earth", or a load element's label ("B–C"). */
  key: string;
  /** As on the chip: "B–N", "A–earth". */
  label: string;
  point: ReadingPoint;
}

export interface AcrossGroup {
  kind: AcrossGroupKind;
  title: string;
  choices: AcrossChoice[];
}

const PHASES: readonly PhaseId[] = ['A', 'B', 'C'];
const PHASE_PAIRS: readonly [PhaseId, PhaseId][] = [
  ['A', 'B'],
  ['B', 'C'],
  ['C', 'A'],
];

export function acrossKey(point: ReadingPoint): string {
  return point.kind === 'bus' ? `${point.from}-${point.to}` : (point.element ?? '');
}

export function acrossLabel(point: ReadingPoint): string {
  return point.kind === 'bus' ? `${point.from}–${point.to}` : (point.element ?? '');
}

function busChoice(busId: string, from: ConductorId, to: ConductorId | 'earth'): AcrossChoice {
  const point: ReadingPoint = { kind: 'bus', busId, from, to };
  return { key: acrossKey(point), label: acrossLabel(point), point };
}

/** The pairs a meter can be put across on a bus with these bars; a group only when its bars are there. */
export function busAcross(busId: string, bars: readonly ConductorId[]): AcrossGroup[] {
  const phases = PHASES.filter((p) => bars.includes(p));
  const hasN = bars.includes('N');
  const hasPE = bars.includes('PE');
  const groups: AcrossGroup[] = [
    { kind: 'neutral', title: 'To neutral', choices: hasN ? phases.map((p) => busChoice(busId, p, 'N')) : [] },
    { kind: 'phases', title: 'Between phases', choices: PHASE_PAIRS.filter(([a, b]) => phases.includes(a) && phases.includes(b)).map(([a, b]) => busChoice(busId, a, b)) },
    { kind: 'ground', title: 'To the ground bar', choices: hasPE ? [...phases, ...(hasN ? (['N'] as const) : [])].map((c) => busChoice(busId, c, 'PE')) : [] },
    // Remote earth: a reference rod driven away from the building's own electrodes.
    { kind: 'earth', title: 'To remote earth', choices: bars.map((c) => busChoice(busId, c, 'earth')) },
  ];
  return groups.filter((g) => g.choices.length > 0);
}

/** A load's elements to choose from; none for a load of one element (the reading is across it). */
export function loadAcross(loadId: string, labels: readonly string[]): AcrossGroup[] {
  if (labels.length < 2) return [];
  return [{ kind: 'element', title: 'Element', choices: labels.map((label) => ({ key: label, label, point: { kind: 'load', loadId, element: label } })) }];
}

/** What a reading at this element can be across (read from the document's own bars and connection). */
export function acrossAt(element: SheetElement): AcrossGroup[] {
  if (element.kind === 'bus') return busAcross(element.id, terminalConductors(element, 'bars') ?? []);
  if (element.kind === 'load') return loadAcross(element.id, loadElementLabels(element));
  return [];
}

/**
 * Where a new reading at this element is across: a bus's first phase to neutral where it has a neutral bar, else
 * to earth; a load's first element (named when it has several, so the entry says which).
 */
export function defaultPointAt(element: SheetElement): ReadingPoint | null {
  if (element.kind === 'load') {
    const labels = loadElementLabels(element);
    return labels.length > 1 ? { kind: 'load', loadId: element.id, element: labels[0] } : { kind: 'load', loadId: element.id };
  }
  if (element.kind !== 'bus') return null;
  const groups = busAcross(element.id, terminalConductors(element, 'bars') ?? []);
  const choice = groups.find((g) => g.kind === 'neutral')?.choices[0] ?? groups.find((g) => g.kind === 'earth')?.choices[0];
  return choice?.point ?? null;
}

/** The choice matching a point among the groups, if the element still offers it. */
export function findAcross(groups: readonly AcrossGroup[], point: ReadingPoint): AcrossChoice | undefined {
  const key = acrossKey(point);
  return groups.flatMap((g) => g.choices).find((c) => c.key === key);
}
