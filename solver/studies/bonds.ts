// Neutral-to-ground bonds: one belongs at the service and at each separately derived system (NEC 250.24(A)(5),
// 250.142(B), from memory); anywhere else it puts neutral current on the equipment ground, which is flagged with it.
import type { Sheet } from '../../shared/sheet';
import type { BondResult, RunResult } from '../results/types';
import type { FeedTree } from '../solve/feed-tree';
import type { BondFinding } from './types';

/** The runs that feed a bus: walking up the tree through breakers and connections to the first run. */
function feedingRuns(sheet: Sheet, tree: FeedTree, busId: string): string[] {
  let at = tree.parent.get(busId);
  while (at !== undefined) {
    const e = sheet.elements[at];
    if (!e || e.kind === 'bus' || e.kind === 'transformer' || e.kind === 'source') return [];
    if (e.kind === 'run') return [at];
    at = tree.parent.get(at);
  }
  return [];
}

export function bondFindings(sheet: Sheet, tree: FeedTree, bonds: BondResult[], runs: RunResult[]): BondFinding[] {
  const runById = new Map(runs.map((r) => [r.runId, r]));
  return bonds.map((b) => {
    const bus = sheet.elements[b.busId];
    const name = bus?.name || b.busId;
    const role = bus?.kind === 'bus' ? bus.role : 'unknown';
    const groundConductorAmperes = feedingRuns(sheet, tree, b.busId).flatMap((runId) => {
      const pe = runById.get(runId)?.conductors.PE;
      return pe ? [{ runId, amperes: pe.current.magnitude }] : [];
    });
    if (b.permitted) {
      return { busId: b.busId, name, role, permitted: true, bondAmperes: b.amperes, groundConductorAmperes, status: 'ok', message: `the bond at ${name} (${role}) is where it belongs` };
    }
    const onPe = groundConductorAmperes.map((g) => `${g.amperes.toFixed(1)} A on the PE of ${g.runId}`).join(', ');
    return {
      busId: b.busId,
      name,
      role,
      permitted: false,
      bondAmperes: b.amperes,
      groundConductorAmperes,
      status: 'flagged',
      message:
        `a neutral-to-ground bond at ${name} (a ${role}, downstream of the service and not a separately derived system) diverts ` +
        `${b.amperes.toFixed(1)} A of neutral current onto the equipment ground${onPe ? ` (${onPe})` : ''}; ` +
        'NEC 250.24(A)(5) and 250.142(B) allow the bond only at the service and at a separately derived system (from memory)',
    };
  });
}
