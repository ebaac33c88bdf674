// A connection lands each mapped conductor of one end on the named conductor of the other: a zero-impedance tie,
// or, in a what-if, an opening or a resistance (a failing lug).
import { c } from '../complex';
import type { Connection, ConductorId } from '../../shared/sheet';
import { connectionConductorProblems, connectionProblem, terminalConductors } from '../../shared/sheet';
import type { BuilderContext } from './builder-context';
import { connectionConductorKey } from './modifications';

export function buildConnection(ctx: BuilderContext, connection: Connection): void {
  const problem = connectionProblem(ctx.sheet, connection);
  if (problem) {
    ctx.warn(`${problem}; the connection is left out`, connection.id);
    return;
  }
  for (const message of connectionConductorProblems(ctx.sheet, connection)) ctx.warn(`${message}; that conductor is left out`, connection.id);
  const fromEl = ctx.sheet.elements[connection.from.elementId];
  const toEl = ctx.sheet.elements[connection.to.elementId];
  const fromSet = terminalConductors(fromEl, connection.from.terminal) ?? [];
  const toSet = terminalConductors(toEl, connection.to.terminal) ?? [];
  for (const [f, t] of Object.entries(connection.conductorMap) as [ConductorId, ConductorId][]) {
    if (!fromSet.includes(f) || !toSet.includes(t)) continue;
    const key = connectionConductorKey(connection.id, f);
    const a = ctx.pin(connection.from.elementId, connection.from.terminal, f);
    const b = ctx.pin(connection.to.elementId, connection.to.terminal, t);
    ctx.nominalLinks.push([a, b]);
    if (ctx.mods.openConnections.has(key)) continue;
    const ohms = ctx.mods.degradedConnections.get(key);
    if (ohms !== undefined) ctx.stampBranch('degraded-connection', connection.id, a, b, c(1 / ohms));
    else ctx.tie(a, b, 'connection', connection.id, f);
  }
}
