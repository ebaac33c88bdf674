// A load as one, two-terminal element per phase (three for three-phase wye or delta), each stamped as its
// admittance at rated voltage, conj(S) / |V|²; constant-current and constant-power shares are corrected later.
import type { Complex } from '../complex';
import { c } from '../complex';
import type { ConductorId, LoadElement, LoadKind } from '../../shared/sheet';
import type { BuilderContext } from './builder-context';
import type { LoadBehaviour } from './types';

const SQRT3 = Math.sqrt(3);

/** How each load kind behaves with voltage when the sheet gives no fractions (our defaults; solver/README.md). */
export const DEFAULT_BEHAVIOUR: Record<LoadKind, LoadBehaviour> = {
  heating: { impedance: 1, current: 0, power: 0 },
  lighting: { impedance: 0, current: 1, power: 0 },
  receptacles: { impedance: 0.5, current: 0, power: 0.5 },
  motor: { impedance: 0, current: 0, power: 1 },
  electronics: { impedance: 0, current: 0, power: 1 },
};

/** The load's behaviour mix; fractions it does not give take the remainder, constant impedance first. */
export function loadBehaviour(load: LoadElement): LoadBehaviour {
  const z = load.constantImpedanceFraction;
  const i = load.constantCurrentFraction;
  const p = load.constantPowerFraction;
  if (z === undefined && i === undefined && p === undefined) return { ...DEFAULT_BEHAVIOUR[load.loadKind] };
  const given = (z ?? 0) + (i ?? 0) + (p ?? 0);
  const rest = Math.max(0, 1 - given);
  if (z === undefined) return { impedance: rest, current: i ?? 0, power: p ?? 0 };
  if (p === undefined) return { impedance: z, current: i ?? 0, power: rest };
  return { impedance: z, current: i ?? rest, power: p };
}

interface PartSpec {
  label: string;
  p: ConductorId;
  q: ConductorId;
  ratedVolts: number;
  phase: 'A' | 'B' | 'C';
}

function partSpecs(load: LoadElement): PartSpec[] {
  switch (load.connection) {
    case 'line-to-neutral':
      return [{ label: 'A–N', p: 'A', q: 'N', ratedVolts: load.ratedVolts, phase: 'A' }];
    case 'line-to-line':
      return [{ label: 'A–B', p: 'A', q: 'B', ratedVolts: load.ratedVolts, phase: 'A' }];
    case 'three-phase-wye':
      return (['A', 'B', 'C'] as const).map((ph) => ({ label: `${ph}–N`, p: ph, q: 'N' as const, ratedVolts: load.ratedVolts / SQRT3, phase: ph }));
    case 'three-phase-delta':
      return [
        { label: 'A–B', p: 'A', q: 'B', ratedVolts: load.ratedVolts, phase: 'A' },
        { label: 'B–C', p: 'B', q: 'C', ratedVolts: load.ratedVolts, phase: 'B' },
        { label: 'C–A', p: 'C', q: 'A', ratedVolts: load.ratedVolts, phase: 'C' },
      ];
  }
}

/** The load's elements by label ("A–N"; "A–B", "B–C", "C–A"), as the results and readings name them. */
export function loadElementLabels(load: LoadElement): string[] {
  return partSpecs(load).map((spec) => spec.label);
}

/** Complex power of one element at rated voltage, VA, before any what-if scaling. */
export function partRatedVa(load: LoadElement, part: PartSpec, parts: number): Complex {
  const pf = load.phasePowerFactor?.[part.phase] ?? load.powerFactor;
  const sign = load.leading ? -1 : 1;
  const tan = Math.sqrt(Math.max(0, 1 - pf * pf)) / pf;
  let watts: number;
  if (load.givenAs === 'amperes') {
    // The line current: a three-phase element carries √3 V_LL I / 3 whether wye or delta.
    const va = parts === 3 ? (SQRT3 * load.ratedVolts * load.amperes) / 3 : part.ratedVolts * load.amperes;
    watts = va * pf;
  } else if (load.phaseKw) {
    watts = (load.phaseKw[part.phase] ?? 0) * 1000;
  } else {
    watts = (load.kw * 1000) / parts;
  }
  return c(watts, sign * watts * tan);
}

export function buildLoad(ctx: BuilderContext, load: LoadElement): void {
  const specs = partSpecs(load);
  const factor = ctx.mods.loadScale.get(load.id) ?? 1;
  const behaviour = loadBehaviour(load);
  for (const spec of specs) {
    const rated = partRatedVa(load, spec, specs.length);
    const ratedVa = c(rated.re * factor, rated.im * factor);
    const v2 = spec.ratedVolts * spec.ratedVolts;
    const y = c(ratedVa.re / v2, -ratedVa.im / v2);
    const p = ctx.pin(load.id, 'supply', spec.p);
    const q = ctx.pin(load.id, 'supply', spec.q);
    const stampIndex = ctx.stampBranch('load', load.id, p, q, y);
    ctx.stamps[stampIndex].loadElement = ctx.loads.length;
    ctx.loads.push({
      loadId: load.id,
      label: spec.label,
      p,
      q,
      ratedVa,
      ratedVolts: spec.ratedVolts,
      behaviour,
      loadKind: load.loadKind,
      y,
      stampIndex,
    });
  }
}
