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
import type { OpeningBlock } from './opening-solver';

/** Below this share of nominal a load has lost its supply rather than seeing an abnormal voltage. */
export const WITHOUT_VOLTAGE_FRACTION = 0.05;

export type CaseFigures = Pick<BreakCase, 'worstOver' | 'worstUnder' | 'loadsOutside' | 'loadsTolerable' | 'loadsWithoutVoltage' | 'severityPercent'>;

export class LoadWatch {
  private readonly count: number;
  private readonly part: Int32Array;
  private readonly pClass: Int32Array;
  private readonly qClass: Int32Array;
  readonly pScale: Float64Array;
  readonly qScale: Float64Array;
  readonly offRe: Float64Array;
  readonly offIm: Float64Array;
  readonly nominal: Float64Array;
  readonly normalLo: Float64Array;
  readonly normalHi: Float64Array;
  readonly tolerableLo: Float64Array;
  readonly tolerableHi: Float64Array;
  readonly volts: Float64Array;
  /** The watched elements by pivot step of their p class, for reading a block (built on first use). */
  private byStep?: StepOrder;

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

  /**
   * The figures of the openings `cases` of a block, each with the largest |x| met (for the residual check), in one
   * pass over the loads: an element's data is read once for every case, and the block's rows come in order.
   * `watch.lastVolts()` afterwards holds the last listed case's voltages.
   */
  fromBlock(block: OpeningBlock, cases: readonly number[]): { figures: CaseFigures; xMax: number }[] {
    const order = this.stepOrder(block.place);
    const count = cases.length;
    // t by block column (zero for the columns of cases not asked for), and each case's columns.
    const tRe = new Float64Array(block.width);
    const tIm = new Float64Array(block.width);
    const first = new Int32Array(count);
    const end = new Int32Array(count);
    cases.forEach((i, c) => {
      const k = block.cases[i];
      if (!k.tRe || !k.tIm) throw new RangeError('a case without an answer has no figures');
      first[c] = k.offset;
      end[c] = k.offset + k.update.m;
      tRe.set(k.tRe, k.offset);
      tIm.set(k.tIm, k.offset);
    });
    const acc = new CaseAccumulators(count);
    readBlock(this, order, block, tRe, tIm, first, end, acc);
    return cases.map((_, c) => ({ figures: this.figuresOf(acc, c), xMax: Math.sqrt(acc.xMax[c]) }));
  }

  private stepOrder(place: Int32Array): StepOrder {
    if (this.byStep && this.byStep.place === place) return this.byStep;
    // The reference (class −1) reads the block's zero row n.
    const stepOf = (c: number) => (c >= 0 ? place[c] : place.length);
    const element = Int32Array.from({ length: this.count }, (_, t) => t).sort((s, t) => stepOf(this.pClass[s]) - stepOf(this.pClass[t]));
    const byElement = (values: Float64Array) => Float64Array.from(element, (t) => values[t]);
    this.byStep = {
      place,
      count: this.count,
      element,
      pStep: Int32Array.from(element, (t) => stepOf(this.pClass[t])),
      qStep: Int32Array.from(element, (t) => stepOf(this.qClass[t])),
      pScale: byElement(this.pScale),
      qScale: byElement(this.qScale),
      offRe: byElement(this.offRe),
      offIm: byElement(this.offIm),
      floor: Float64Array.from(element, (t) => WITHOUT_VOLTAGE_FRACTION * this.nominal[t]),
      invNominal: Float64Array.from(element, (t) => 1 / this.nominal[t]),
      normalLo: byElement(this.normalLo),
      normalHi: byElement(this.normalHi),
      tolerableLo: byElement(this.tolerableLo),
      tolerableHi: byElement(this.tolerableHi),
    };
    return this.byStep;
  }

  private figuresOf(acc: CaseAccumulators, c: number): CaseFigures {
    const worstOver = acc.over[c] >= 0 ? this.excursion(acc.over[c], 'over', acc.overVolts[c]) : undefined;
    const worstUnder = acc.under[c] >= 0 ? this.excursion(acc.under[c], 'under', acc.underVolts[c]) : undefined;
    const severityPercent = Math.max(0, worstOver?.beyondPercent ?? 0, worstUnder?.beyondPercent ?? 0);
    return { worstOver, worstUnder, loadsOutside: acc.outside[c], loadsTolerable: acc.tolerable[c], loadsWithoutVoltage: acc.without[c], severityPercent };
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
    const acc = new CaseAccumulators(1);
    for (let t = 0; t < this.count; t++) acc.add(0, t, this.volts[t], this.nominal[t], this.normalLo[t], this.normalHi[t], this.tolerableLo[t], this.tolerableHi[t]);
    return this.figuresOf(acc, 0);
  }

  private excursion(t: number, side: 'over' | 'under', v: number): LoadExcursion {
    const part = this.network.loads[this.part[t]];
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

/** The watched elements' data in the order a block is read (entry e for element element[e]). */
interface StepOrder {
  place: Int32Array;
  count: number;
  /** Watched element indices, by the pivot step of their p class. */
  element: Int32Array;
  pStep: Int32Array;
  qStep: Int32Array;
  pScale: Float64Array;
  qScale: Float64Array;
  offRe: Float64Array;
  offIm: Float64Array;
  /** Below this the element is without voltage. */
  floor: Float64Array;
  invNominal: Float64Array;
  normalLo: Float64Array;
  normalHi: Float64Array;
  tolerableLo: Float64Array;
  tolerableHi: Float64Array;
}

/** The running figures of several cases at once: the worst over and under so far, and the counts. */
class CaseAccumulators {
  readonly over: Int32Array;
  readonly under: Int32Array;
  readonly overBeyond: Float64Array;
  readonly underBeyond: Float64Array;
  readonly overVolts: Float64Array;
  readonly underVolts: Float64Array;
  readonly outside: Int32Array;
  readonly tolerable: Int32Array;
  readonly without: Int32Array;
  readonly xMax: Float64Array;

  constructor(count: number) {
    this.over = new Int32Array(count).fill(-1);
    this.under = new Int32Array(count).fill(-1);
    this.overBeyond = new Float64Array(count).fill(-Infinity);
    this.underBeyond = new Float64Array(count).fill(-Infinity);
    this.overVolts = new Float64Array(count);
    this.underVolts = new Float64Array(count);
    this.outside = new Int32Array(count);
    this.tolerable = new Int32Array(count);
    this.without = new Int32Array(count);
    this.xMax = new Float64Array(count);
  }

  add(c: number, t: number, v: number, nominal: number, normalLo: number, normalHi: number, tolerableLo: number, tolerableHi: number): void {
    if (v < WITHOUT_VOLTAGE_FRACTION * nominal) {
      this.without[c]++;
      return;
    }
    if (v < tolerableLo || v > tolerableHi) this.outside[c]++;
    else if (v < normalLo || v > normalHi) this.tolerable[c]++;
    const above = (v - normalHi) / nominal;
    const below = (normalLo - v) / nominal;
    if (above > this.overBeyond[c]) {
      this.overBeyond[c] = above;
      this.over[c] = t;
      this.overVolts[c] = v;
    }
    if (below > this.underBeyond[c]) {
      this.underBeyond[c] = below;
      this.under[c] = t;
      this.underVolts[c] = v;
    }
  }
}

type WatchData = Pick<LoadWatch, 'volts'>;

/**
 * The loop of LoadWatch.fromBlock, on locals only: for each watched element, x at its two classes in every case
 * of the block (x = x0 − W t, the case's columns), its voltage, and the running figures. The last case's
 * voltages are left in `volts`.
 */
function readBlock(
  w: WatchData,
  order: StepOrder,
  block: OpeningBlock,
  tRe: Float64Array,
  tIm: Float64Array,
  first: Int32Array,
  end: Int32Array,
  acc: CaseAccumulators,
): void {
  const { values: w2, width, x0Re, x0Im } = block;
  const { volts } = w;
  const { element, pStep, qStep, pScale, qScale, offRe, offIm, floor, invNominal, normalLo, normalHi, tolerableLo, tolerableHi } = order;
  const { over, under, overBeyond, underBeyond, overVolts, underVolts, outside, tolerable, without, xMax } = acc;
  const count = first.length;
  const last = count - 1;
  for (let e = 0; e < order.count; e++) {
    const kp = pStep[e];
    const kq = qStep[e];
    const sp = pScale[e];
    const sq = qScale[e];
    const rowP = 2 * kp * width;
    const rowQ = 2 * kq * width;
    const x0pr = x0Re[kp];
    const x0pi = x0Im[kp];
    const x0qr = x0Re[kq];
    const x0qi = x0Im[kq];
    const oRe = offRe[e];
    const oIm = offIm[e];
    const inv = invNominal[e];
    const bottom = floor[e];
    const lo = normalLo[e];
    const hi = normalHi[e];
    const tLo = tolerableLo[e];
    const tHi = tolerableHi[e];
    for (let c = 0; c < count; c++) {
      let pr = x0pr;
      let pi = x0pi;
      let qr = x0qr;
      let qi = x0qi;
      for (let b = first[c], stop = end[c]; b < stop; b++) {
        const tr = tRe[b];
        const ti = tIm[b];
        const apr = w2[rowP + 2 * b];
        const api = w2[rowP + 2 * b + 1];
        const aqr = w2[rowQ + 2 * b];
        const aqi = w2[rowQ + 2 * b + 1];
        pr -= apr * tr - api * ti;
        pi -= apr * ti + api * tr;
        qr -= aqr * tr - aqi * ti;
        qi -= aqr * ti + aqi * tr;
      }
      const xp = pr * pr + pi * pi;
      const xq = qr * qr + qi * qi;
      const xm = xp > xq ? xp : xq;
      if (xm > xMax[c]) xMax[c] = xm;
      const re = oRe + sp * pr - sq * qr;
      const im = oIm + sp * pi - sq * qi;
      const v = Math.sqrt(re * re + im * im);
      if (c === last) volts[element[e]] = v;
      if (v < bottom) {
        without[c]++;
        continue;
      }
      if (v < tLo || v > tHi) outside[c]++;
      else if (v < lo || v > hi) tolerable[c]++;
      const above = (v - hi) * inv;
      const below = (lo - v) * inv;
      if (above > overBeyond[c]) {
        overBeyond[c] = above;
        over[c] = element[e];
        overVolts[c] = v;
      }
      if (below > underBeyond[c]) {
        underBeyond[c] = below;
        under[c] = element[e];
        underVolts[c] = v;
      }
    }
  }
}
