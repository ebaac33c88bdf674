// A utility source: its EMF as known voltages (ties with an offset from its star point), and, when it is not
// infinite, its Z1/Z0 as a coupled impedance between the EMF and the terminals: self (Z0 + 2Z1)/3, mutual (Z0 − Z1)/3.
import type { Complex, ComplexMatrix } from '../complex';
import { c, matInverse, polar, scale, zeros } from '../complex';
import type { ConductorId, SourceElement } from '../../shared/sheet';
import type { BuilderContext } from './builder-context';
import { EARTH_PIN } from './types';
import { twoPortStamp } from './two-port';

interface Emf {
  conductor: ConductorId;
  volts: Complex;
}

/** The open-circuit EMF of each phase against the star point, at the operating voltage (or at 1.0 per unit). */
export function sourceEmfs(s: SourceElement, perUnit = s.voltsPerUnit): Emf[] {
  switch (s.system) {
    case 'three-phase-wye':
    case 'three-phase-delta': {
      const vln = (s.nominalVolts * perUnit) / Math.sqrt(3);
      return [
        { conductor: 'A', volts: polar(vln, s.angleDeg) },
        { conductor: 'B', volts: polar(vln, s.angleDeg - 120) },
        { conductor: 'C', volts: polar(vln, s.angleDeg + 120) },
      ];
    }
    case 'single-phase':
      return [{ conductor: 'A', volts: polar(s.nominalVolts * perUnit, s.angleDeg) }];
    case 'split-phase': {
      const half = (s.nominalVolts * perUnit) / 2;
      return [
        { conductor: 'A', volts: polar(half, s.angleDeg) },
        { conductor: 'B', volts: polar(half, s.angleDeg + 180) },
      ];
    }
  }
}

/** Positive- and zero-sequence impedance of the source, ohms, or undefined for an infinite source. */
export function sourceSequenceOhms(s: SourceElement): { z1: Complex; z0: Complex } | undefined {
  const fromMagnitude = (zOhms: number): Complex => {
    const r = zOhms / Math.sqrt(1 + s.xOverR * s.xOverR);
    return c(r, r * s.xOverR);
  };
  // The voltage the strength is quoted across: line-to-line for three-phase and split-phase, else line-to-neutral.
  const threePhase = s.system === 'three-phase-wye' || s.system === 'three-phase-delta';
  switch (s.strength) {
    case 'infinite':
      return undefined;
    case 'fault-current': {
      const amperes = s.faultCurrentKa! * 1000;
      const z1 = fromMagnitude(threePhase ? s.nominalVolts / (Math.sqrt(3) * amperes) : s.nominalVolts / amperes);
      return { z1, z0: scale(z1, s.zeroToPositiveRatio) };
    }
    case 'short-circuit-mva': {
      const z1 = fromMagnitude((s.nominalVolts * s.nominalVolts) / (s.shortCircuitMva! * 1e6));
      return { z1, z0: scale(z1, s.zeroToPositiveRatio) };
    }
    case 'impedance': {
      const z1 = c(s.r1Ohms!, s.x1Ohms!);
      const z0 = s.r0Ohms !== undefined && s.x0Ohms !== undefined ? c(s.r0Ohms, s.x0Ohms) : z1;
      return { z1, z0 };
    }
  }
}

/** Impedance matrix between EMF and terminal per phase conductor. */
function sourceImpedanceMatrix(s: SourceElement, z1: Complex, z0: Complex, phases: number): ComplexMatrix {
  const z = zeros(phases);
  if (phases === 3) {
    const self = scale({ re: z0.re + 2 * z1.re, im: z0.im + 2 * z1.im }, 1 / 3);
    const mutual = scale({ re: z0.re - z1.re, im: z0.im - z1.im }, 1 / 3);
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) z[i][j] = i === j ? { ...self } : { ...mutual };
    return z;
  }
  // Split-phase: the strength is quoted across A–B, so each leg carries half of that impedance.
  const leg = s.system === 'split-phase' ? scale(z1, 0.5) : z1;
  for (let i = 0; i < phases; i++) z[i][i] = { ...leg };
  return z;
}

export function buildSource(ctx: BuilderContext, s: SourceElement): void {
  const star = ctx.pin(s.id, 'internal', 'star');
  const emfs = sourceEmfs(s);
  const nominalEmfs = sourceEmfs(s, 1);
  const zoneVolts = Math.max(...nominalEmfs.map((e) => Math.hypot(e.volts.re, e.volts.im)));
  const hasNeutral = s.system !== 'three-phase-delta';
  if (hasNeutral) ctx.tie(ctx.pin(s.id, 'out', 'N'), star, 'source-neutral', s.id, 'N');
  if (s.grounding === 'solid') ctx.tie(star, EARTH_PIN, 'solid-ground', s.id, 'N');
  else if (s.grounding === 'resistance') ctx.stampBranch('grounding', s.id, star, EARTH_PIN, c(1 / s.groundingOhms));

  const sequence = sourceSequenceOhms(s);
  const layout = { sourceId: s.id, starPin: star, emfTies: [] as { conductor: ConductorId; tieIndex: number }[] };
  const emfPins: number[] = [];
  const outPins: number[] = [];
  emfs.forEach((emf, i) => {
    const out = ctx.pin(s.id, 'out', emf.conductor);
    const at = sequence ? ctx.pin(s.id, 'internal', `emf-${emf.conductor}`) : out;
    const tieIndex = ctx.tie(at, star, 'source-emf', s.id, emf.conductor, emf.volts);
    ctx.nominalSeeds.push({ a: at, b: star, volts: nominalEmfs[i].volts, zoneVolts });
    layout.emfTies.push({ conductor: emf.conductor, tieIndex });
    emfPins.push(at);
    outPins.push(out);
  });
  ctx.sources.push(layout);
  if (!sequence) return;
  const y = matInverse(sourceImpedanceMatrix(s, sequence.z1, sequence.z0, emfs.length));
  ctx.stamp({
    kind: 'source-impedance',
    elementId: s.id,
    pins: [...emfPins, ...outPins],
    y: twoPortStamp(y),
    galvanic: emfPins.map((p, i) => [p, outPins[i]] as [number, number]),
  });
  if (emfs.length !== 3) ctx.assume('A single-phase or split-phase source impedance is carried in the phase conductors only.');
}
