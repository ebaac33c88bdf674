// Conductor size designations used by the sheet format and the conductor tables.
// AWG sizes run from small to large ("14" is smaller than "1/0"); kcmil sizes are plain numbers of thousands of circular mils.

export const AWG_KCMIL_SIZES = [
  '14', '12', '10', '8', '6', '4', '3', '2', '1',
  '1/0', '2/0', '3/0', '4/0',
  '250', '300', '350', '400', '500', '600', '750',
] as const;
export type AwgKcmilSize = (typeof AWG_KCMIL_SIZES)[number];

// IEC 60228 nominal cross-sections in mm².
export const METRIC_SIZES_MM2 = [1.5, 2.5, 4, 6, 10, 16, 25, 35, 50, 70, 95, 120, 150, 185, 240] as const;
export type MetricSizeMm2 = (typeof METRIC_SIZES_MM2)[number];

export const CONDUCTOR_MATERIALS = ['copper', 'aluminum'] as const;
export type ConductorMaterial = (typeof CONDUCTOR_MATERIALS)[number];

// NEC Chapter 9 Table 9 distinguishes these raceways; "none" is cable in free air or direct burial, judged as PVC.
export const RACEWAY_KINDS = ['pvc', 'aluminum', 'steel'] as const;
export type RacewayKind = (typeof RACEWAY_KINDS)[number];

export function isKcmil(size: AwgKcmilSize): boolean {
  return !size.includes('/') && Number(size) >= 250;
}

export function formatSize(size: AwgKcmilSize): string {
  return isKcmil(size) ? `${size} kcmil` : `${size} AWG`;
}
