// Every load element's voltage in a case, judged against the sheet's standard, reduced to the figures a sweep ranks
// by: the highest and lowest voltage relative to the normal range, and how many loads are outside or without
// voltage. The ranges come from results/standing.ts once per element; a case then costs one pass over the loads.
import type { Sheet } from '../../shared/sheet';
import type { BuiltNetwork } from '../network/build-network';
import type { ComplexVector } from '../linear-system';
import type { PinClasses } from '../solve/classes';
import type { AssembledSystem } from '../solve/assemble';
import type { PinVoltages } from '../solve/load-iteration';
import { judge, snapNominal } from '../results/standing';
import type { BreakCase, LoadExcursion } from './study-types';

/** Below this share of nominal a load has lost its supply rather than seeing an abnormal voltage. */
export const WITHOUT_VOLTAGE_FRACTION = 0.05;

export type CaseFigures = Pick<BreakCase, 'worstOver' | 'worstUnder' | 'loadsOutside' | 'loadsTolerable' | 'loadsWithoutVoltage' | 'severityPercent'>;

export class LoadWatch {
  private readonly count: number;
  private readonly part: Int32Array;
  private readonly pClass: Int32Array;
  private readonly qClass: Int32Array;
  private readonly pScale: Float64Array;
  private readonly qScale: Float64Array;
  private readonly offRe: Float64Array;
  private readonly offIm: Float64Array;
  private readonly nominal: Float64Array;
  private readonly normalLo: Float64Array;
  private readonly normalHi: Float64Array;
  private readonly tolerableLo: Float64Array;
  private readonly tolerableHi: Float64Array;
  private readonly volts: Float64Array;

  constructor(
    private readonly sheet: Sheet,
    private readonly network: BuiltNetwork,
    classes: PinClasses,
    system: AssembledSystem,
  ) {
    let kept: number[] = [];
    const ranges: { nominal: number; normal: [number, number]; tolerable: [number, number] }[] = [];
    network.loads.forEach((part, k) => {
      const n = network.nominal;
      const nominalVolts = snapNominal(Math.hypot(n[part.p].re - n[part.q].re, n[part.p].im - n[part.q].im));
      const load = sheet.elements[part.loadId];
      const standing = judge(sheet.settings, nominalVolts, nominalVolts, 'utilization', load?.kind === 'load' && load.loadKind === 'lighting');
      if (!standing) return;
      kept.push(k);
      ranges.push({ nominal: nominalVolts, normal: standing.normalRange, tolerable: standing.tolerableRange });
    });
    // In class order, so that a pass over the loads walks the unknowns forwards (fewer cache misses on big sheets).
    const order = kept.map((_, t) => t).sort((s, t) => classes.classOf[network.loads[kept[s]].p] - classes.classOf[network.loads[kept[t]].p]);
    kept = order.map((t) => kept[t]);
    const sortedRanges = order.map((t) => ranges[t]);
    ranges.splice(0, ranges.length, ...sortedRanges);
    const c = (this.count = kept.length);
    this.part = Int32Array.from(kept);
    const f = () => new Float64Array(c);
    [this.pScale, this.qScale, this.offRe, this.offIm, this.nominal, this.normalLo, this.normalHi, this.tolerableLo, this.tolerableHi, this.volts] = Array.from({ length: 10 }, f);
    this.pClass = new Int32Array(c);
    this.qClass = new Int32Array(c);
    kept.forEach((k, t) => {
      const { p, q } = network.loads[k];
      this.pClass[t] = classes.classOf[p];
      this.qClass[t] = classes.classOf[q];
      this.pScale[t] = this.pClass[t] >= 0 ? system.scale[this.pClass[t]] : 0;
      this.qScale[t] = this.qClass[t] >= 0 ? system.scale[this.qClass[t]] : 0;
      this.offRe[t] = classes.offsetRe[p] - classes.offsetRe[q];
      this.offIm[t] = classes.offsetIm[p] - classes.offsetIm[q];
      this.nominal[t] = ranges[t].nominal;
      [this.normalLo[t], this.normalHi[t]] = ranges[t].normal;
      [this.tolerableLo[t], this.tolerableHi[t]] = ranges[t].tolerable;
    });
  }

  get elements(): number {
    return this.count;
  }

  /** Load element voltages from the class unknowns x (scaled, as solved). */
  fromUnknowns(x: ComplexVector): CaseFigures {
    for (let t = 0; t < this.count; t++) {
      let re = this.offRe[t];
      let im = this.offIm[t];
      const cp = this.pClass[t];
      const cq = this.qClass[t];
      if (cp >= 0) {
        re += this.pScale[t] * x.re[cp];
        im += this.pScale[t] * x.im[cp];
      }
      if (cq >= 0) {
        re -= this.qScale[t] * x.re[cq];
        im -= this.qScale[t] * x.im[cq];
      }
      this.volts[t] = Math.sqrt(re * re + im * im);
    }
    return this.figures();
  }

  /** Load element voltages from pin voltages (a load iteration's or a fresh solve's answer). */
  fromPins(v: PinVoltages): CaseFigures {
    for (let t = 0; t < this.count; t++) {
      const { p, q } = this.network.loads[this.part[t]];
      this.volts[t] = Math.hypot(v.re[p] - v.re[q], v.im[p] - v.im[q]);
    }
    return this.figures();
  }

  /** Each watched element's voltage in the last case, with its load part index (for checks and plots). */
  lastVolts(): { part: number; volts: number }[] {
    return [...this.part].map((part, t) => ({ part, volts: this.volts[t] }));
  }

  private figures(): CaseFigures {
    let over = -1;
    let under = -1;
    let overBeyond = -Infinity;
    let underBeyond = -Infinity;
    let outside = 0;
    let tolerable = 0;
    let without = 0;
    for (let t = 0; t < this.count; t++) {
      const v = this.volts[t];
      const nominal = this.nominal[t];
      if (v < WITHOUT_VOLTAGE_FRACTION * nominal) {
        without++;
        continue;
      }
      if (v < this.tolerableLo[t] || v > this.tolerableHi[t]) outside++;
      else if (v < this.normalLo[t] || v > this.normalHi[t]) tolerable++;
      const above = (v - this.normalHi[t]) / nominal;
      const below = (this.normalLo[t] - v) / nominal;
      if (above > overBeyond) {
        overBeyond = above;
        over = t;
      }
      if (below > underBeyond) {
        underBeyond = below;
        under = t;
      }
    }
    const worstOver = over >= 0 ? this.excursion(over, 'over') : undefined;
    const worstUnder = under >= 0 ? this.excursion(under, 'under') : undefined;
    const severityPercent = Math.max(0, worstOver?.beyondPercent ?? 0, worstUnder?.beyondPercent ?? 0);
    return { worstOver, worstUnder, loadsOutside: outside, loadsTolerable: tolerable, loadsWithoutVoltage: without, severityPercent };
  }

  private excursion(t: number, side: 'over' | 'under'): LoadExcursion {
    const part = this.network.loads[this.part[t]];
    const v = this.volts[t];
    const nominal = this.nominal[t];
    const beyondVolts = side === 'over' ? v - this.normalHi[t] : this.normalLo[t] - v;
    const standing = v < this.tolerableLo[t] || v > this.tolerableHi[t] ? 'outside' : v < this.normalLo[t] || v > this.normalHi[t] ? 'tolerable' : 'normal';
    return {
      loadId: part.loadId,
      loadName: this.sheet.elements[part.loadId]?.name ?? part.loadId,
      element: part.label,
      volts: v,
      nominalVolts: nominal,
      percentOfNominal: (100 * v) / nominal,
      beyondVolts,
      beyondPercent: (100 * beyondVolts) / nominal,
      standing,
    };
  }
}
