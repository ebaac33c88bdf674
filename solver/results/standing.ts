// Nominal voltages read from the network (snapped to the trade's nominal values) and where a voltage stands
// against the sheet's chosen standard.
import { judgeVoltage } from '../standards';
import type { SheetSettings } from '../../shared/sheet';
import type { Standing } from './types';

// Nominal system voltages of the trade (ANSI C84.1 and IEC 60038 values), line-to-neutral and line-to-line.
const NOMINALS = [120, 208, 240, 277, 347, 480, 600, 230, 400, 690, 2400, 4160, 7200, 12470, 13200, 13800, 14400, 24940, 34500];

/** The trade's nominal nearest to a computed no-load voltage (within 1.5 %), else the value itself. */
export function snapNominal(volts: number): number {
  let best = volts;
  let bestError = 0.015;
  for (const n of NOMINALS) {
    const e = Math.abs(volts - n) / n;
    if (e < bestError) {
      best = n;
      bestError = e;
    }
  }
  return best;
}

export function standardLabel(settings: SheetSettings): string {
  return settings.voltageStandard === 'ansi-c84.1'
    ? 'ANSI C84.1 (Range A normal, Range B tolerable)'
    : 'IEC 60038 (±10 % of nominal)';
}

export function judge(settings: SheetSettings, nominalVolts: number, volts: number, point: 'service' | 'utilization', lighting = true): Standing | undefined {
  if (!(nominalVolts > 1) || !Number.isFinite(volts)) return undefined;
  const j = judgeVoltage({ standard: settings.voltageStandard, nominalVolts, volts, point, lighting });
  return { standing: j.standing, nominalVolts, normalRange: j.normalRange, tolerableRange: j.tolerableRange, label: j.label };
}
