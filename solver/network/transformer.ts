// Transformers as banks of single-phase units. Each unit's windings get a primitive admittance (a two-winding unit:
// its leakage impedance through an ideal ratio; a centre-tapped unit: a three-winding star of the half-winding
// impedances of common practice) mapped onto the terminal pins by the connection, as in Kersting's book.
import type { Complex, ComplexMatrix } from '../complex';
import { c, zeros } from '../complex';
import type { ConductorId, TransformerElement } from '../../shared/sheet';
import { defaultVectorGroup } from '../../shared/sheet';
import type { BuilderContext, TransformerUnitPins } from './builder-context';
import { EARTH_PIN } from './types';

interface WindingSpec {
  side: 'primary' | 'secondary';
  p: ConductorId;
  q: ConductorId;
  /** Rated winding voltage. */
  volts: number;
}
interface UnitSpec {
  windings: WindingSpec[];
  kva: number;
}

const SQRT3 = Math.sqrt(3);
const pri = (p: ConductorId, q: ConductorId, volts: number): WindingSpec => ({ side: 'primary', p, q, volts });
const sec = (p: ConductorId, q: ConductorId, volts: number): WindingSpec => ({ side: 'secondary', p, q, volts });

/** The single-phase units of a bank and which terminal conductors each winding spans. */
export function transformerUnits(t: TransformerElement): UnitSpec[] {
  const vp = t.primaryVolts;
  const vs = t.secondaryVolts;
  const third = t.kva / 3;
  const group = t.vectorGroup ?? defaultVectorGroup(t.connection);
  switch (t.connection) {
    case 'delta-wye-grounded':
      // Dyn1 (ANSI): a–n sits on A–C, so Van lags VAN by 30°. Dyn11: a–n sits on A–B, leading by 30°.
      return group === 'Dyn11'
        ? [
            { windings: [pri('A', 'B', vp), sec('A', 'N', vs / SQRT3)], kva: third },
            { windings: [pri('B', 'C', vp), sec('B', 'N', vs / SQRT3)], kva: third },
            { windings: [pri('C', 'A', vp), sec('C', 'N', vs / SQRT3)], kva: third },
          ]
        : [
            { windings: [pri('A', 'C', vp), sec('A', 'N', vs / SQRT3)], kva: third },
            { windings: [pri('B', 'A', vp), sec('B', 'N', vs / SQRT3)], kva: third },
            { windings: [pri('C', 'B', vp), sec('C', 'N', vs / SQRT3)], kva: third },
          ];
    case 'wye-grounded-wye-grounded':
      return (['A', 'B', 'C'] as const).map((ph) => ({ windings: [pri(ph, 'N', vp / SQRT3), sec(ph, 'N', vs / SQRT3)], kva: third }));
    case 'delta-delta':
      return [
        { windings: [pri('A', 'B', vp), sec('A', 'B', vs)], kva: third },
        { windings: [pri('B', 'C', vp), sec('B', 'C', vs)], kva: third },
        { windings: [pri('C', 'A', vp), sec('C', 'A', vs)], kva: third },
      ];
    case 'high-leg-delta':
      // The C–A winding is centre-tapped for the neutral, so B is the high leg (NEC 110.15).
      return [
        { windings: [pri('A', 'B', vp), sec('A', 'B', vs)], kva: third },
        { windings: [pri('B', 'C', vp), sec('B', 'C', vs)], kva: third },
        { windings: [pri('C', 'A', vp), sec('C', 'N', vs / 2), sec('N', 'A', vs / 2)], kva: third },
      ];
    case 'open-delta':
      // Two units (A–B and C–A, the latter centre-tapped); each is rated at the bank's kVA over √3.
      return [
        { windings: [pri('A', 'B', vp), sec('A', 'B', vs)], kva: t.kva / SQRT3 },
        { windings: [pri('C', 'A', vp), sec('C', 'N', vs / 2), sec('N', 'A', vs / 2)], kva: t.kva / SQRT3 },
      ];
    case 'single-phase':
      return [{ windings: [pri('A', 'N', vp), sec('A', 'N', vs)], kva: t.kva }];
    case 'single-phase-center-tapped':
      return [{ windings: [pri('A', 'N', vp), sec('A', 'N', vs / 2), sec('N', 'B', vs / 2)], kva: t.kva }];
  }
}

/** Per-unit R and X of the nameplate %Z with its X/R. */
function perUnitImpedance(t: TransformerElement): { r: number; x: number } {
  const z = t.percentImpedance / 100;
  const r = z / Math.sqrt(1 + t.xOverR * t.xOverR);
  return { r, x: r * t.xOverR };
}

/** Primitive admittance over a unit's winding voltages (currents into the dotted ends), siemens. */
export function unitPrimitiveAdmittance(t: TransformerElement, unit: UnitSpec): ComplexMatrix {
  const { r, x } = perUnitImpedance(t);
  const va = unit.kva * 1000;
  const tap = 1 + t.tapPercent / 100;
  const k = unit.windings.length;
  let yRef: ComplexMatrix;
  let refVolts: number;
  if (k === 2) {
    // Leakage impedance referred to the secondary winding.
    refVolts = unit.windings[1].volts;
    const zOhms = c((r * refVolts * refVolts) / va, (x * refVolts * refVolts) / va);
    const d = zOhms.re * zOhms.re + zOhms.im * zOhms.im;
    const y = c(zOhms.re / d, -zOhms.im / d);
    yRef = [
      [y, c(-y.re, -y.im)],
      [c(-y.re, -y.im), { ...y }],
    ];
  } else {
    // Centre-tapped: star of Z_H = 0.5R + j0.8X and Z_X = R + j0.4X per half, per unit on the half-winding voltage
    // and the unit's kVA, so that H to one half is 1.5R + j1.2X (common practice; Kersting's model, from memory).
    refVolts = unit.windings[1].volts;
    const base = (refVolts * refVolts) / va;
    const zs = [c(0.5 * r * base, 0.8 * x * base), c(r * base, 0.4 * x * base), c(r * base, 0.4 * x * base)];
    const ys = zs.map((z) => {
      const d = z.re * z.re + z.im * z.im;
      return c(z.re / d, -z.im / d);
    });
    const sum = ys.reduce((a, b) => c(a.re + b.re, a.im + b.im), c(0));
    const sd = sum.re * sum.re + sum.im * sum.im;
    const inv = c(sum.re / sd, -sum.im / sd);
    yRef = zeros(3);
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        const yiyj = c(ys[i].re * ys[j].re - ys[i].im * ys[j].im, ys[i].re * ys[j].im + ys[i].im * ys[j].re);
        const term = c(yiyj.re * inv.re - yiyj.im * inv.im, yiyj.re * inv.im + yiyj.im * inv.re);
        yRef[i][j] = c((i === j ? ys[i].re : 0) - term.re, (i === j ? ys[i].im : 0) - term.im);
      }
    }
  }
  // Refer back through the turns: n_k = winding volts / reference volts (the primary carries the tap).
  const n = unit.windings.map((w) => (w.volts * (w.side === 'primary' ? tap : 1)) / refVolts);
  const yw = yRef.map((row, i) => row.map((v, j) => c(v.re / (n[i] * n[j]), v.im / (n[i] * n[j]))));
  // Magnetising branch on the primary winding; a floor of 1e-6 per unit keeps an unloaded winding determinate.
  const exciting = Math.max(t.excitingCurrentPercent / 100, 1e-6);
  const vpw = unit.windings[0].volts * tap;
  yw[0][0] = c(yw[0][0].re, yw[0][0].im - (exciting * va) / (vpw * vpw));
  return yw;
}

/** Nodal block Cᵀ Yw C over the unit's distinct pins. */
function windingsToPins(yw: ComplexMatrix, windings: { p: number; q: number }[]): { pins: number[]; y: ComplexMatrix } {
  const pins: number[] = [];
  const at = (pin: number) => {
    let i = pins.indexOf(pin);
    if (i < 0) {
      pins.push(pin);
      i = pins.length - 1;
    }
    return i;
  };
  const incidence = windings.map((w) => [at(w.p), at(w.q)] as const);
  const y = zeros(pins.length);
  for (let a = 0; a < windings.length; a++) {
    for (let b = 0; b < windings.length; b++) {
      const v: Complex = yw[a][b];
      const [pa, qa] = incidence[a];
      const [pb, qb] = incidence[b];
      y[pa][pb] = c(y[pa][pb].re + v.re, y[pa][pb].im + v.im);
      y[qa][qb] = c(y[qa][qb].re + v.re, y[qa][qb].im + v.im);
      y[pa][qb] = c(y[pa][qb].re - v.re, y[pa][qb].im - v.im);
      y[qa][pb] = c(y[qa][pb].re - v.re, y[qa][pb].im - v.im);
    }
  }
  return { pins, y };
}

export function buildTransformer(ctx: BuilderContext, t: TransformerElement): void {
  const terminal = (side: 'primary' | 'secondary') => side;
  const record: TransformerUnitPins = { transformerId: t.id, units: [], secondaryPins: [] };
  for (const unit of transformerUnits(t)) {
    const windings = unit.windings.map((w) => ({
      p: ctx.pin(t.id, terminal(w.side), w.p),
      q: ctx.pin(t.id, terminal(w.side), w.q),
      nominalVolts: w.volts,
      side: w.side,
    }));
    record.units.push({ windings });
    for (const w of windings) {
      if (w.side === 'secondary') for (const pin of [w.p, w.q]) if (!record.secondaryPins.includes(pin)) record.secondaryPins.push(pin);
    }
    const { pins, y } = windingsToPins(unitPrimitiveAdmittance(t, unit), windings);
    ctx.stamp({ kind: 'transformer', elementId: t.id, pins, y, galvanic: windings.map((w) => [w.p, w.q] as [number, number]) });
  }
  const primaryNeutral = ctx.findPin(t.id, 'primary', 'N');
  const secondaryNeutral = ctx.findPin(t.id, 'secondary', 'N');
  if (secondaryNeutral !== undefined) record.secondaryNeutralPin = secondaryNeutral;
  ctx.transformers.push(record);
  const ground = (pin: number | undefined, how: TransformerElement['primaryGrounding'], ohms: number) => {
    if (pin === undefined || how === 'none') return;
    if (how === 'solid') ctx.tie(pin, EARTH_PIN, 'solid-ground', t.id, 'N');
    else ctx.stampBranch('grounding', t.id, pin, EARTH_PIN, c(1 / ohms));
  };
  ground(primaryNeutral, t.primaryGrounding, t.primaryGroundingOhms);
  ground(secondaryNeutral, t.secondaryGrounding, t.secondaryGroundingOhms);
  if (t.connection === 'high-leg-delta' || t.connection === 'open-delta' || t.connection === 'single-phase-center-tapped') {
    ctx.assume('Centre-tapped windings use the half-winding impedances of common practice: H to one half 1.5R + j1.2X, between halves 2R + j0.8X, per unit of the unit kVA on the half-winding voltage (Kersting’s model, from memory).');
  }
  if (t.connection === 'high-leg-delta') ctx.assume('A high-leg delta bank is three equal units (the lighting unit is not larger).');
}
