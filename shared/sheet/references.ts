// Checks of every reference by id (connections to elements and terminals, what-if changes to their targets).
// A dangling reference is a warning, never an exception: concurrent deletes in a shared document leave them behind.
import type { Connection, ConductorId, Sheet, WhatIfChange } from './schema';
import { terminalConductors, terminalNames } from './terminals';
import type { SheetIssue } from './issues';

/** Why a connection cannot be used, or undefined when it can. Conductors missing at one end are reported apart. */
export function connectionProblem(sheet: Sheet, connection: Connection): string | undefined {
  for (const endName of ['from', 'to'] as const) {
    const end = connection[endName];
    const element = sheet.elements[end.elementId];
    if (!element) return `connection ${connection.id}: its '${endName}' element ${end.elementId} does not exist (deleted?)`;
    if (!terminalNames(element).includes(end.terminal)) {
      return `connection ${connection.id}: ${element.kind} ${end.elementId} has no terminal '${end.terminal}' (it has ${terminalNames(element).join(', ')})`;
    }
  }
  return undefined;
}

/** Conductor pairs of a usable connection that name a conductor missing at either end (those pairs are skipped). */
export function connectionConductorProblems(sheet: Sheet, connection: Connection): string[] {
  const fromEl = sheet.elements[connection.from.elementId];
  const toEl = sheet.elements[connection.to.elementId];
  if (!fromEl || !toEl) return [];
  const fromSet = terminalConductors(fromEl, connection.from.terminal) ?? [];
  const toSet = terminalConductors(toEl, connection.to.terminal) ?? [];
  const out: string[] = [];
  for (const [f, t] of Object.entries(connection.conductorMap) as [ConductorId, ConductorId][]) {
    if (!fromSet.includes(f)) {
      out.push(`connection ${connection.id}: ${fromEl.kind} ${fromEl.id} '${connection.from.terminal}' has no ${f} conductor`);
    } else if (!toSet.includes(t)) {
      out.push(`connection ${connection.id}: ${toEl.kind} ${toEl.id} '${connection.to.terminal}' has no ${t} conductor`);
    }
  }
  return out;
}

/** Why a what-if change cannot be applied, or undefined when it can. */
export function changeProblem(sheet: Sheet, change: WhatIfChange): string | undefined {
  switch (change.kind) {
    case 'open-conductor':
    case 'degrade-conductor': {
      const run = sheet.elements[change.runId];
      if (!run) return `run ${change.runId} does not exist (deleted?)`;
      if (run.kind !== 'run') return `${change.runId} is a ${run.kind}, not a run`;
      if (!run.conductors[change.conductor]) return `run ${change.runId} has no ${change.conductor} conductor`;
      return undefined;
    }
    case 'open-pole': {
      const breaker = sheet.elements[change.breakerId];
      if (!breaker) return `breaker ${change.breakerId} does not exist (deleted?)`;
      if (breaker.kind !== 'breaker') return `${change.breakerId} is a ${breaker.kind}, not a breaker`;
      const pole = { A: breaker.poleA, B: breaker.poleB, C: breaker.poleC }[change.pole];
      if (pole === 'none') return `breaker ${change.breakerId} has no pole on ${change.pole}`;
      return undefined;
    }
    case 'open-connection':
    case 'degrade-connection': {
      const connection = sheet.connections[change.connectionId];
      if (!connection) return `connection ${change.connectionId} does not exist (deleted?)`;
      if (!connection.conductorMap[change.conductor]) {
        return `connection ${change.connectionId} carries no ${change.conductor} conductor from its 'from' end`;
      }
      return undefined;
    }
    case 'scale-loads':
      return sheet.elements[change.elementId] ? undefined : `element ${change.elementId} does not exist (deleted?)`;
    case 'shunt-fault': {
      const bus = sheet.elements[change.busId];
      if (!bus) return `bus ${change.busId} does not exist (deleted?)`;
      return bus.kind === 'bus' ? undefined : `${change.busId} is a ${bus.kind}, not a bus`;
    }
  }
}

/** Every dangling or mismatched reference in the sheet, as warnings with the id of the item that holds it. */
export function findReferenceProblems(sheet: Sheet): SheetIssue[] {
  const out: SheetIssue[] = [];
  for (const connection of Object.values(sheet.connections)) {
    const problem = connectionProblem(sheet, connection);
    if (problem) {
      out.push({ path: `connections.${connection.id}`, message: problem, elementId: connection.id });
      continue;
    }
    for (const message of connectionConductorProblems(sheet, connection)) {
      out.push({ path: `connections.${connection.id}.conductorMap`, message, elementId: connection.id });
    }
  }
  for (const whatIf of Object.values(sheet.whatIfs)) {
    for (const [changeId, change] of Object.entries(whatIf.changes)) {
      const problem = changeProblem(sheet, change);
      if (problem) {
        out.push({ path: `whatIfs.${whatIf.id}.changes.${changeId}`, message: `what-if ${whatIf.id}: ${problem}`, elementId: whatIf.id });
      }
    }
  }
  return out;
}
