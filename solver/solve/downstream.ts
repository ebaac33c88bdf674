// Which elements lie downstream of an element: those that lose every path to a source when it is removed.
import type { Sheet } from '../../shared/sheet';
import { connectionProblem } from '../../shared/sheet';

function elementGraph(sheet: Sheet): Map<string, Set<string>> {
  const graph = new Map<string, Set<string>>();
  for (const id of Object.keys(sheet.elements)) graph.set(id, new Set());
  for (const connection of Object.values(sheet.connections)) {
    if (connectionProblem(sheet, connection)) continue;
    graph.get(connection.from.elementId)!.add(connection.to.elementId);
    graph.get(connection.to.elementId)!.add(connection.from.elementId);
  }
  return graph;
}

/**
 * Elements downstream of `elementId`. With scope 'panel' the walk stops at the next bus, so only the panel's own
 * branch circuits are included.
 */
export function downstreamElements(sheet: Sheet, elementId: string, scope: 'downstream' | 'panel'): Set<string> {
  const graph = elementGraph(sheet);
  const upstream = new Set<string>();
  const queue = Object.values(sheet.elements)
    .filter((e) => e.kind === 'source' && e.id !== elementId)
    .map((e) => e.id);
  queue.forEach((id) => upstream.add(id));
  for (let head = 0; head < queue.length; head++) {
    const id = queue[head];
    for (const next of graph.get(id) ?? []) {
      if (next === elementId || upstream.has(next)) continue;
      upstream.add(next);
      queue.push(next);
    }
  }
  const out = new Set<string>();
  const walk = [elementId];
  for (let head = 0; head < walk.length; head++) {
    const id = walk[head];
    for (const next of graph.get(id) ?? []) {
      if (next === elementId || upstream.has(next) || out.has(next)) continue;
      out.add(next);
      if (scope === 'panel' && sheet.elements[next].kind === 'bus') continue;
      walk.push(next);
    }
  }
  return out;
}
