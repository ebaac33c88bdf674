// The fault study as the studies panel shows it: one row per bus and fault type with its standing against the
// interrupting ratings of the equipment at that bus, the duty checks (failures first, as the solver ranks them),
// and the service markings of NEC 110.24. Pure: the same rows feed the phone cards, the wide table and the tests.
import type { ShuntFaultType, WhatIfChange } from '../../shared/sheet';
import { peakFactor, type DutyCheck, type DutyStatus, type FaultStudyResult } from '../../solver';
import { FAULT_TYPE_LABEL } from './fault-labels';
import { queryRows, type CellValue, type TableQuery } from './table-query';

/** A case against the ratings at its bus: fails, passes only with the duty raised for a high X/R, passes, or nothing rated there. */
export type CaseStatus = 'fails' | 'x-over-r-above-test' | 'passes' | 'no-rating' | 'no-figures';

export const CASE_STATUS_RANK: Record<CaseStatus, number> = { fails: 0, 'x-over-r-above-test': 1, passes: 2, 'no-rating': 3, 'no-figures': 4 };

export const CASE_STATUS_LABEL: Record<CaseStatus, string> = {
  fails: 'Exceeds a rating',
  'x-over-r-above-test': 'Within rating (X/R above test)',
  passes: 'Within ratings',
  'no-rating': 'No rating here',
  'no-figures': 'No figures',
};

export interface FaultCaseRow {
  key: string;
  busId: string;
  busName: string;
  faultType: ShuntFaultType;
  faultLabel: string;
  symmetricalKa?: number;
  peakKa?: number;
  xOverR?: number;
  problem?: string;
  status: CaseStatus;
  /** Sorts the statuses worst first (0 = fails). */
  statusRank: number;
  /** The lowest interrupting rating among the equipment at this bus, kA. */
  lowestRatingKa?: number;
  /** The smallest margin, percent of rating, over that equipment (negative: exceeded). */
  marginPercent?: number;
  /** The names of the equipment at this bus whose rating this case exceeds. */
  exceeds: string[];
  isService: boolean;
}

export interface DutyRow {
  key: string;
  elementId: string;
  name: string;
  kindLabel: string;
  locationBusId: string;
  locationName: string;
  interruptingKa: number;
  dutyKa: number;
  adjustedDutyKa: number;
  faultLabel: string;
  xOverR: number;
  testXOverR: number;
  status: DutyStatus;
  marginPercent: number;
}

export interface MarkingRow {
  busId: string;
  busName: string;
  availableFaultKa: number;
  faultLabel: string;
  xOverR: number;
  /** The words of the field marking, with the date the figure was found. */
  marking: string;
}

export interface FaultStudyView {
  cases: FaultCaseRow[];
  duties: DutyRow[];
  markings: MarkingRow[];
  unlocated: string[];
  summary: string;
  cancelled: boolean;
  assumptions: string[];
}

export type FaultCaseColumn = 'bus' | 'faultType' | 'symmetricalKa' | 'peakKa' | 'xOverR' | 'status' | 'marginPercent';

/** A duty scaled for an X/R above the rating's test X/R (the solver's rule, applied to one case). */
function adjustedDuty(symmetricalKa: number, xOverR: number, testXOverR: number): number {
  return xOverR > testXOverR ? (symmetricalKa * peakFactor(xOverR)) / peakFactor(testXOverR) : symmetricalKa;
}

function caseStanding(symmetricalKa: number, xOverR: number, rated: DutyCheck[], nameOf: (id: string) => string) {
  let status: CaseStatus = 'passes';
  let margin = Infinity;
  const exceeds: string[] = [];
  for (const d of rated) {
    const adjusted = adjustedDuty(symmetricalKa, xOverR, d.testXOverR);
    margin = Math.min(margin, (100 * (d.interruptingKa - adjusted)) / d.interruptingKa);
    if (adjusted > d.interruptingKa) {
      status = 'fails';
      exceeds.push(nameOf(d.elementId));
    } else if (status !== 'fails' && xOverR > d.testXOverR) status = 'x-over-r-above-test';
  }
  return { status, margin, exceeds };
}

export function faultStudyView(
  study: FaultStudyResult,
  nameOf: (id: string) => string,
  kindOf: (id: string) => string | undefined,
  options: { busRoles?: Map<string, string>; dateText?: string } = {},
): FaultStudyView {
  const ratedAt = new Map<string, DutyCheck[]>();
  for (const d of study.duties) ratedAt.set(d.locationBusId, [...(ratedAt.get(d.locationBusId) ?? []), d]);
  const services = new Set(study.serviceMarkings.map((m) => m.busId));
  const cases = study.cases.map((c): FaultCaseRow => {
    const rated = ratedAt.get(c.busId) ?? [];
    const base = {
      key: `${c.busId}|${c.faultType}`,
      busId: c.busId,
      busName: nameOf(c.busId),
      faultType: c.faultType,
      faultLabel: FAULT_TYPE_LABEL[c.faultType],
      symmetricalKa: c.symmetricalKa,
      peakKa: c.peakKa,
      xOverR: c.xOverR,
      problem: c.problem,
      isService: services.has(c.busId) || options.busRoles?.get(c.busId) === 'service',
      lowestRatingKa: rated.length ? Math.min(...rated.map((d) => d.interruptingKa)) : undefined,
    };
    if (c.symmetricalKa === undefined || c.xOverR === undefined) return { ...base, status: 'no-figures', statusRank: CASE_STATUS_RANK['no-figures'], exceeds: [] };
    if (rated.length === 0) return { ...base, status: 'no-rating', statusRank: CASE_STATUS_RANK['no-rating'], exceeds: [] };
    const s = caseStanding(c.symmetricalKa, c.xOverR, rated, nameOf);
    return { ...base, status: s.status, statusRank: CASE_STATUS_RANK[s.status], marginPercent: s.margin, exceeds: s.exceeds };
  });
  // Failures first, then by margin (least first), then the largest currents.
  cases.sort(
    (a, b) =>
      a.statusRank - b.statusRank ||
      (a.marginPercent ?? Infinity) - (b.marginPercent ?? Infinity) ||
      (b.symmetricalKa ?? -1) - (a.symmetricalKa ?? -1) ||
      a.key.localeCompare(b.key),
  );
  const duties = study.duties.map(
    (d): DutyRow => ({
      key: d.elementId,
      elementId: d.elementId,
      name: nameOf(d.elementId),
      kindLabel: d.elementKind === 'bus' ? 'Bus' : kindOf(d.elementId) === 'breaker' ? 'Breaker' : d.elementKind,
      locationBusId: d.locationBusId,
      locationName: nameOf(d.locationBusId),
      interruptingKa: d.interruptingKa,
      dutyKa: d.dutyKa,
      adjustedDutyKa: d.adjustedDutyKa,
      faultLabel: FAULT_TYPE_LABEL[d.faultType],
      xOverR: d.xOverR,
      testXOverR: d.testXOverR,
      status: d.status,
      marginPercent: d.marginPercent,
    }),
  );
  const date = options.dateText;
  const markings = study.serviceMarkings.map(
    (m): MarkingRow => ({
      busId: m.busId,
      busName: nameOf(m.busId),
      availableFaultKa: m.availableFaultKa,
      faultLabel: FAULT_TYPE_LABEL[m.faultType],
      xOverR: m.xOverR,
      marking: `Maximum available fault current ${m.availableFaultKa.toFixed(1)} kA symmetrical${date ? `, calculated ${date}` : ''}`,
    }),
  );
  const failing = duties.filter((d) => d.status === 'fails').length;
  const summary =
    duties.length === 0
      ? `${cases.length} cases; no interrupting ratings to check`
      : failing > 0
        ? `${failing} of ${duties.length} interrupting ratings exceeded`
        : `All ${duties.length} interrupting ratings hold`;
  return { cases, duties, markings, unlocated: study.unlocated.map(nameOf), summary: study.cancelled ? `Stopped early: ${summary}` : summary, cancelled: study.cancelled, assumptions: study.assumptions };
}

export function faultCaseCell(row: FaultCaseRow, key: FaultCaseColumn): CellValue {
  switch (key) {
    case 'bus':
      return row.busName;
    case 'faultType':
      return row.faultType;
    case 'status':
      // Sorts by rank; filters by the status name.
      return row.status;
    default:
      return row[key];
  }
}

const SORT_CELL = (row: FaultCaseRow, key: FaultCaseColumn): CellValue => (key === 'status' ? row.statusRank : faultCaseCell(row, key));

/** The rows a query lets through, in its order (filters by fault type and status names, words in the bus name). */
export function queryFaultCases(rows: readonly FaultCaseRow[], query: TableQuery<FaultCaseColumn>): FaultCaseRow[] {
  const filtered = queryRows(rows, { ...query, sort: null }, faultCaseCell, (r) => `${r.busName} ${r.faultLabel}`);
  return query.sort ? queryRows(filtered, { sort: query.sort, text: '', only: {} }, SORT_CELL, () => '') : filtered;
}

/** The what-if that shows a case on the drawing: the same fault the study solved (bolted, to the bus's ground bar). */
export function faultCaseChange(row: Pick<FaultCaseRow, 'busId' | 'faultType'>): WhatIfChange {
  return { kind: 'shunt-fault', busId: row.busId, faultType: row.faultType, to: 'PE', faultOhms: 0, faultReactanceOhms: 0 };
}

/** How a standing is drawn (the tag standings of the drawing: tint and outline). */
export const CASE_STATUS_STANDING: Record<CaseStatus, 'outside' | 'tolerable' | 'normal' | 'plain'> = {
  fails: 'outside',
  'x-over-r-above-test': 'tolerable',
  passes: 'normal',
  'no-rating': 'plain',
  'no-figures': 'plain',
};

export const DUTY_STATUS_LABEL: Record<DutyStatus, string> = { fails: 'Exceeded', 'passes-x-over-r-above-test': 'Holds (X/R above test)', passes: 'Holds' };
export const DUTY_STATUS_STANDING: Record<DutyStatus, 'outside' | 'tolerable' | 'normal'> = { fails: 'outside', 'passes-x-over-r-above-test': 'tolerable', passes: 'normal' };

/** kA with one decimal (three significant figures below 1 kA); a dash for none. */
export function formatKa(ka: number | undefined): string {
  if (ka === undefined || !Number.isFinite(ka)) return '—';
  return ka < 1 ? ka.toPrecision(2) : ka.toFixed(1);
}

export function formatMargin(percent: number | undefined): string {
  if (percent === undefined || !Number.isFinite(percent)) return '—';
  return `${percent > 0 ? '+' : percent < 0 ? '−' : ''}${Math.abs(percent).toFixed(0)} %`;
}
