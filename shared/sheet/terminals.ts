// The terminals of each element kind and the conductors each terminal carries (the editor draws them, the solver
// turns them into nodes, connections must name them).
import type { ConductorId, SheetElement, TransformerConnection } from './schema';

const THREE_WIRE: ConductorId[] = ['A', 'B', 'C'];
const FOUR_WIRE: ConductorId[] = ['A', 'B', 'C', 'N'];

/** Terminal names per kind; a bus has one set of bars that every connection lands on. */
export const TERMINALS = {
  source: ['out'],
  transformer: ['primary', 'secondary'],
  bus: ['bars'],
  run: ['from', 'to'],
  breaker: ['line', 'load'],
  load: ['supply'],
  electrode: ['lead'],
} as const satisfies Record<SheetElement['kind'], readonly string[]>;

/** Conductors of a transformer winding side. Single-phase units: H1 is A and H2 is N; X1 is A, X2 is N and X3 is B. */
export function transformerSideConductors(connection: TransformerConnection, side: 'primary' | 'secondary'): ConductorId[] {
  switch (connection) {
    case 'delta-wye-grounded':
      return side === 'primary' ? THREE_WIRE : FOUR_WIRE;
    case 'wye-grounded-wye-grounded':
      return FOUR_WIRE;
    case 'delta-delta':
      return THREE_WIRE;
    case 'high-leg-delta':
    case 'open-delta':
      return side === 'primary' ? THREE_WIRE : FOUR_WIRE;
    case 'single-phase':
      return ['A', 'N'];
    case 'single-phase-center-tapped':
      return side === 'primary' ? ['A', 'N'] : ['A', 'N', 'B'];
  }
}

export function terminalNames(element: SheetElement): readonly string[] {
  return TERMINALS[element.kind];
}

/** The conductors a terminal carries, or undefined when the element has no such terminal. */
export function terminalConductors(element: SheetElement, terminal: string): ConductorId[] | undefined {
  if (!(TERMINALS[element.kind] as readonly string[]).includes(terminal)) return undefined;
  switch (element.kind) {
    case 'source':
      switch (element.system) {
        case 'three-phase-wye':
          return FOUR_WIRE;
        case 'three-phase-delta':
          return THREE_WIRE;
        case 'single-phase':
          return ['A', 'N'];
        case 'split-phase':
          return ['A', 'B', 'N'];
      }
    // falls through only if the enum grows
    case 'transformer':
      return transformerSideConductors(element.connection, terminal as 'primary' | 'secondary');
    case 'bus': {
      const out: ConductorId[] = [];
      if (element.phaseA) out.push('A');
      if (element.phaseB) out.push('B');
      if (element.phaseC) out.push('C');
      if (element.neutralBar) out.push('N');
      if (element.groundBar) out.push('PE');
      return out;
    }
    case 'run':
      return (Object.keys(element.conductors) as ConductorId[]).sort(byConductorOrder);
    case 'breaker': {
      const out: ConductorId[] = [];
      if (element.poleA !== 'none') out.push('A');
      if (element.poleB !== 'none') out.push('B');
      if (element.poleC !== 'none') out.push('C');
      if (element.carriesNeutral) out.push('N');
      if (element.carriesGround) out.push('PE');
      return out;
    }
    case 'load':
      switch (element.connection) {
        case 'line-to-neutral':
          return ['A', 'N'];
        case 'line-to-line':
          return ['A', 'B'];
        case 'three-phase-wye':
          return FOUR_WIRE;
        case 'three-phase-delta':
          return THREE_WIRE;
      }
    // falls through only if the enum grows
    case 'electrode':
      return ['PE'];
  }
}

const ORDER: Record<ConductorId, number> = { A: 0, B: 1, C: 2, N: 3, PE: 4 };
export function byConductorOrder(a: ConductorId, b: ConductorId): number {
  return ORDER[a] - ORDER[b];
}
