// A what-if resolved into lookups that the network builder consults while it converts the sheet (never a copy).
import type { ConductorId, PhaseId } from '../../shared/sheet';

export interface Modifications {
  whatIfId?: string;
  /** "runId|conductor" */
  openRunConductors: Set<string>;
  /** "runId|conductor" → series ohms added */
  addedRunOhms: Map<string, number>;
  /** "breakerId|pole" */
  openPoles: Set<string>;
  /** "connectionId|fromConductor" */
  openConnections: Set<string>;
  /** "connectionId|fromConductor" → ohms replacing the tie */
  degradedConnections: Map<string, number>;
  /** loadId → factor applied to its power */
  loadScale: Map<string, number>;
}

export const NO_MODIFICATIONS: Modifications = {
  openRunConductors: new Set(),
  addedRunOhms: new Map(),
  openPoles: new Set(),
  openConnections: new Set(),
  degradedConnections: new Map(),
  loadScale: new Map(),
};

export const runConductorKey = (runId: string, conductor: ConductorId) => `${runId}|${conductor}`;
export const poleKey = (breakerId: string, pole: PhaseId) => `${breakerId}|${pole}`;
export const connectionConductorKey = (connectionId: string, conductor: ConductorId) => `${connectionId}|${conductor}`;
