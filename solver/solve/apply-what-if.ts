// Resolves a what-if's changes into the lookups the network builder consults. Nothing of the sheet is copied.
import type { ConductorId, Sheet } from '../../shared/sheet';
import { changeProblem } from '../../shared/sheet';
import type { Modifications } from '../network/modifications';
import { connectionConductorKey, NO_MODIFICATIONS, poleKey, runConductorKey } from '../network/modifications';
import { downstreamElements } from './downstream';
import type { FaultSpec } from '../faults/fault-types';

export type WhatIfOutcome =
  | { ok: true; mods: Modifications; warnings: { message: string; elementId?: string }[]; touchesNeutral: boolean; fault?: FaultSpec }
  | { ok: false; code: 'unknown-what-if' | 'not-supported'; message: string; elementIds: string[] };

export function applyWhatIf(sheet: Sheet, whatIfId: string | undefined): WhatIfOutcome {
  if (whatIfId === undefined) return { ok: true, mods: NO_MODIFICATIONS, warnings: [], touchesNeutral: false };
  const whatIf = sheet.whatIfs[whatIfId];
  if (!whatIf) {
    const known = Object.keys(sheet.whatIfs);
    return {
      ok: false,
      code: 'unknown-what-if',
      message: `the sheet has no what-if "${whatIfId}"${known.length ? ` (it has ${known.join(', ')})` : ' (it has none)'}`,
      elementIds: [],
    };
  }
  const mods: Modifications = {
    whatIfId,
    openRunConductors: new Set(),
    addedRunOhms: new Map(),
    openPoles: new Set(),
    openConnections: new Set(),
    degradedConnections: new Map(),
    loadScale: new Map(),
  };
  const warnings: { message: string; elementId?: string }[] = [];
  let touchesNeutral = false;
  let fault: FaultSpec | undefined;
  const neutral = (c: ConductorId) => {
    if (c === 'N') touchesNeutral = true;
  };
  for (const [changeId, change] of Object.entries(whatIf.changes)) {
    if (change.kind === 'shunt-fault') {
      if (fault) {
        return {
          ok: false,
          code: 'not-supported',
          message: `what-if ${whatIfId}, change ${changeId}: one shunt fault per what-if (this one has more)`,
          elementIds: [change.busId],
        };
      }
      const problem = changeProblem(sheet, change);
      if (problem) return { ok: false, code: 'not-supported', message: `what-if ${whatIfId}, change ${changeId}: ${problem}`, elementIds: [change.busId] };
      const phases = (['A', 'B', 'C'] as const).filter((p) => change.phases?.[p]);
      fault = { busId: change.busId, faultType: change.faultType, to: change.to, faultOhms: { re: change.faultOhms, im: change.faultReactanceOhms }, ...(phases.length ? { phases } : {}) };
      continue;
    }
    const problem = changeProblem(sheet, change);
    if (problem) {
      warnings.push({ message: `what-if ${whatIfId}, change ${changeId}: ${problem}; the change is ignored` });
      continue;
    }
    switch (change.kind) {
      case 'open-conductor':
        mods.openRunConductors.add(runConductorKey(change.runId, change.conductor));
        neutral(change.conductor);
        break;
      case 'degrade-conductor': {
        const key = runConductorKey(change.runId, change.conductor);
        mods.addedRunOhms.set(key, (mods.addedRunOhms.get(key) ?? 0) + change.addedOhms);
        neutral(change.conductor);
        break;
      }
      case 'open-pole':
        mods.openPoles.add(poleKey(change.breakerId, change.pole));
        break;
      case 'open-connection':
        mods.openConnections.add(connectionConductorKey(change.connectionId, change.conductor));
        neutral(change.conductor);
        break;
      case 'degrade-connection':
        mods.degradedConnections.set(connectionConductorKey(change.connectionId, change.conductor), change.ohms);
        neutral(change.conductor);
        break;
      case 'scale-loads':
        for (const id of downstreamElements(sheet, change.elementId, change.scope)) {
          if (sheet.elements[id].kind === 'load') mods.loadScale.set(id, (mods.loadScale.get(id) ?? 1) * change.factor);
        }
        if (sheet.elements[change.elementId].kind === 'load') {
          mods.loadScale.set(change.elementId, (mods.loadScale.get(change.elementId) ?? 1) * change.factor);
        }
        break;
    }
  }
  return { ok: true, mods, warnings, touchesNeutral, ...(fault ? { fault } : {}) };
}
