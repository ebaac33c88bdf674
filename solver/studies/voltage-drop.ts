// Voltage drop of each run and summed from the start of its voltage zone, against the 3 % and 5 % guidance.
import type { Sheet } from '../../shared/sheet';
import type { RunResult } from '../results/types';
import { runsFromOrigin, type FeedTree } from '../solve/feed-tree';
import type { VoltageDropEntry } from './types';

/** Whether anything downstream of an element is a bus (a feeder) or only loads (a branch circuit). */
function feedsABus(sheet: Sheet, tree: FeedTree, id: string): boolean {
  const stack = [...(tree.children.get(id) ?? [])];
  while (stack.length) {
    const next = stack.pop()!;
    const e = sheet.elements[next];
    if (e?.kind === 'bus') return true;
    if (e?.kind === 'transformer') return true;
    stack.push(...(tree.children.get(next) ?? []));
  }
  return false;
}

export function voltageDrops(sheet: Sheet, tree: FeedTree, runs: RunResult[], runLimit: number, totalLimit: number): VoltageDropEntry[] {
  const dropOf = new Map(runs.map((r) => [r.runId, r.voltageDropPercent]));
  return runs.map((r) => {
    const { originId, path } = runsFromOrigin(sheet, tree, r.runId);
    const drops = path.map((id) => dropOf.get(id));
    const known = drops.every((d) => d !== undefined);
    const entry: VoltageDropEntry = {
      runId: r.runId,
      name: r.name,
      role: feedsABus(sheet, tree, r.runId) ? 'feeder' : 'branch',
      path,
      status: 'no-data',
      ...(originId ? { originId } : {}),
    };
    if (r.voltageDropPercent !== undefined) entry.dropPercent = r.voltageDropPercent;
    if (known && path.length > 0) entry.cumulativePercent = (drops as number[]).reduce((a, b) => a + b, 0);
    if (entry.dropPercent !== undefined) {
      entry.status =
        entry.cumulativePercent !== undefined && entry.cumulativePercent > totalLimit ? 'over-total' : entry.dropPercent > runLimit ? 'over-run' : 'ok';
    }
    return entry;
  });
}
