// Where a voltage stands against ANSI C84.1 Table 1 (Range A and Range B, service and utilization) or IEC 60038
// (±10 % at the supply terminals). The ANSI rows are from memory of Table 1; other nominals scale the 120 V row.

export type VoltageStanding = 'normal' | 'tolerable' | 'outside';
export type VoltageStandardId = 'ansi-c84.1' | 'iec-60038';
export type VoltagePoint = 'service' | 'utilization';

/** One nominal's row of ANSI C84.1 Table 1, in volts. */
interface AnsiRow {
  rangeA: { serviceMin: number; max: number; utilizationMin: number };
  rangeB: { serviceMin: number; max: number; utilizationMin: number };
}

// From memory of ANSI C84.1 Table 1; the wye rows give line-to-line (and line-to-neutral under the L–N nominal).
// The 240 V row is 120/240 V three-wire and the 277 V row is the line-to-neutral of 480Y/277.
const ANSI_TABLE_1: Record<number, AnsiRow> = {
  120: { rangeA: { serviceMin: 114, max: 126, utilizationMin: 108 }, rangeB: { serviceMin: 110, max: 127, utilizationMin: 104 } },
  208: { rangeA: { serviceMin: 197, max: 218, utilizationMin: 187 }, rangeB: { serviceMin: 191, max: 220, utilizationMin: 180 } },
  240: { rangeA: { serviceMin: 228, max: 252, utilizationMin: 216 }, rangeB: { serviceMin: 220, max: 254, utilizationMin: 208 } },
  277: { rangeA: { serviceMin: 263, max: 291, utilizationMin: 249 }, rangeB: { serviceMin: 254, max: 293, utilizationMin: 240 } },
  480: { rangeA: { serviceMin: 456, max: 504, utilizationMin: 432 }, rangeB: { serviceMin: 440, max: 508, utilizationMin: 416 } },
};

// Table 1 notes, from memory, on a 120 V base: Range A utilization does not exceed 125 V (and multiples for other
// nominals); circuits not supplying lighting have a higher utilization minimum, 110 V in Range A and 106 V in B.
const ANSI_UTILIZATION_MAX_A_PER_120 = 125;
const ANSI_NON_LIGHTING_MIN_PER_120 = { rangeA: 110, rangeB: 106 };

const IEC_60038_TOLERANCE = 0.1;

export interface VoltageJudgementInput {
  standard: VoltageStandardId;
  nominalVolts: number;
  volts: number;
  point: VoltagePoint;
  /** Utilization only: does the circuit supply lighting? Defaults to true (the lower, 108 V minimum). */
  lighting?: boolean;
}

export interface VoltageJudgement {
  standing: VoltageStanding;
  normalRange: [number, number];
  tolerableRange: [number, number];
  label: string;
}

function ansiRow(nominalVolts: number): AnsiRow {
  const row = ANSI_TABLE_1[nominalVolts];
  if (row) return row;
  const k = nominalVolts / 120;
  const base = ANSI_TABLE_1[120];
  const scaled = (r: AnsiRow['rangeA']) => ({ serviceMin: r.serviceMin * k, max: r.max * k, utilizationMin: r.utilizationMin * k });
  return { rangeA: scaled(base.rangeA), rangeB: scaled(base.rangeB) };
}

function ansiRanges(nominalVolts: number, point: VoltagePoint, lighting: boolean) {
  const row = ansiRow(nominalVolts);
  const k = nominalVolts / 120;
  if (point === 'service') {
    return {
      normal: [row.rangeA.serviceMin, row.rangeA.max] as [number, number],
      tolerable: [row.rangeB.serviceMin, row.rangeB.max] as [number, number],
      label: 'ANSI C84.1 service: Range A normal, Range B tolerable',
    };
  }
  const minA = lighting ? row.rangeA.utilizationMin : ANSI_NON_LIGHTING_MIN_PER_120.rangeA * k;
  const minB = lighting ? row.rangeB.utilizationMin : ANSI_NON_LIGHTING_MIN_PER_120.rangeB * k;
  return {
    normal: [minA, ANSI_UTILIZATION_MAX_A_PER_120 * k] as [number, number],
    tolerable: [minB, row.rangeB.max] as [number, number],
    label: `ANSI C84.1 utilization${lighting ? '' : ' (no lighting)'}: Range A normal, Range B tolerable`,
  };
}

function iecRanges(nominalVolts: number) {
  const range: [number, number] = [nominalVolts * (1 - IEC_60038_TOLERANCE), nominalVolts * (1 + IEC_60038_TOLERANCE)];
  // IEC 60038 gives one band; there is no second, tolerable one.
  return { normal: range, tolerable: [...range] as [number, number], label: 'IEC 60038: nominal ±10 %' };
}

/** Standing of a voltage magnitude; range limits count as inside. */
export function judgeVoltage(input: VoltageJudgementInput): VoltageJudgement {
  const { standard, nominalVolts, volts, point } = input;
  if (!(nominalVolts > 0) || !Number.isFinite(nominalVolts)) {
    throw new RangeError(`nominal voltage ${nominalVolts} V must be positive`);
  }
  if (!(volts >= 0) || !Number.isFinite(volts)) throw new RangeError(`voltage ${volts} V must be a magnitude ≥ 0`);
  if (point !== 'service' && point !== 'utilization') throw new RangeError(`unknown point "${point as string}"`);
  let ranges: { normal: [number, number]; tolerable: [number, number]; label: string };
  if (standard === 'ansi-c84.1') ranges = ansiRanges(nominalVolts, point, input.lighting ?? true);
  else if (standard === 'iec-60038') ranges = iecRanges(nominalVolts);
  else throw new RangeError(`unknown voltage standard "${standard as string}"`);
  const within = ([lo, hi]: [number, number]) => volts >= lo && volts <= hi;
  const standing: VoltageStanding = within(ranges.normal) ? 'normal' : within(ranges.tolerable) ? 'tolerable' : 'outside';
  return { standing, normalRange: ranges.normal, tolerableRange: ranges.tolerable, label: ranges.label };
}
