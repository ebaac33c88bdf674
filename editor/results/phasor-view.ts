// A bus's phasor diagram as plain numbers: each phase's voltage and the neutral point against the ground
// reference (the bus's PE bar, else remote earth), the neutral's shift, and a scale that fits the largest phasor.
import type { PhaseId } from '../../shared/sheet';
import type { BusResult } from '../../solver';

export interface PhasorPoint {
  name: PhaseId | 'N';
  re: number;
  im: number;
}

export interface PhasorView {
  phases: PhasorPoint[];
  neutral: PhasorPoint | null;
  /** |V_N − V_ground|: how far the neutral point has moved from where it belongs. */
  neutralShiftVolts: number | null;
  /** Line-to-neutral magnitude of each phase, for the figures beside the drawing. */
  lineToNeutralVolts: Partial<Record<PhaseId, number>>;
  /** Largest distance of any point from the ground reference. */
  extentVolts: number;
}

export function phasorView(bus: BusResult): PhasorView {
  const ground = bus.conductors.PE?.phasor ?? { re: 0, im: 0 };
  const rel = (p: { re: number; im: number }) => ({ re: p.re - ground.re, im: p.im - ground.im });
  const phases: PhasorPoint[] = [];
  for (const name of ['A', 'B', 'C'] as const) {
    const k = bus.conductors[name];
    if (k) phases.push({ name, ...rel(k.phasor) });
  }
  const n = bus.conductors.N;
  const neutral = n ? { name: 'N' as const, ...rel(n.phasor) } : null;
  const extent = Math.max(1, ...phases.map((p) => Math.hypot(p.re, p.im)), neutral ? Math.hypot(neutral.re, neutral.im) : 0);
  return {
    phases,
    neutral,
    neutralShiftVolts: neutral && !bus.ungrounded ? Math.hypot(neutral.re, neutral.im) : null,
    lineToNeutralVolts: bus.lineToNeutralVolts,
    extentVolts: extent,
  };
}
