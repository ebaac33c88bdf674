// Plain words for the five shunt fault types, long (tables, what-if names) and short (phone cards, chips).
import type { ShuntFaultType } from '../../shared/sheet';

export const FAULT_TYPE_LABEL: Record<ShuntFaultType, string> = {
  'three-phase': 'Three-phase',
  'line-to-ground': 'Line to ground',
  'line-to-line': 'Line to line',
  'double-line-to-ground': 'Double line to ground',
  'line-to-neutral': 'Line to neutral',
};

export const FAULT_TYPE_SHORT: Record<ShuntFaultType, string> = {
  'three-phase': '3φ',
  'line-to-ground': 'L–G',
  'line-to-line': 'L–L',
  'double-line-to-ground': 'L–L–G',
  'line-to-neutral': 'L–N',
};
