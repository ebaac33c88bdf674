// The drawing's colours: its ground and ink, conductor colours by the sheet's convention, and the value tags'
// standings. Plain data in shared/ because the canvas and the server's exports (SVG, PNG, PDF) draw with the same.

export type PhaseConvention = 'north-american' | 'iec-60445';
export type ConductorName = 'A' | 'B' | 'C' | 'N' | 'PE';

/** A conductor's line: its colour, a casing under it where the colour would vanish on the ground, and a stripe. */
export interface ConductorInk {
  stroke: string;
  casing?: string;
  /** A second colour dashed over the first (green-yellow). */
  stripe?: string;
}

export interface DrawingPalette {
  /** The sheet's ground (drafting paper or deep slate) and its faint dot grid. */
  ground: string;
  dot: string;
  ink: string;
  /** De-energised parts. */
  inkDead: string;
  /** Back-fed parts: live only through loads, a hazard. */
  hazard: string;
  selection: string;
  error: string;
  label: string;
  terminal: string;
}

export const drawingPalette: Record<'light' | 'dark', DrawingPalette> = {
  light: {
    ground: '#F4EFE3',
    dot: '#CFC5AE',
    ink: '#1E2830',
    inkDead: '#9A9A92',
    hazard: '#B4531A',
    selection: '#1F5673',
    error: '#A2332B',
    label: '#4F5B64',
    terminal: '#7C858B',
  },
  dark: {
    ground: '#131A20',
    dot: '#2C3944',
    ink: '#E7E2D6',
    inkDead: '#66717A',
    hazard: '#F0A05A',
    selection: '#7DB8D6',
    error: '#E57D72',
    label: '#A7AFB5',
    terminal: '#7D878E',
  },
};

// The trade's conductor colours. North American practice: black, red, blue phases, white neutral, green ground.
// IEC 60445: brown, black, grey phases, blue neutral, green-and-yellow protective conductor.
export const conductorInk: Record<'light' | 'dark', Record<PhaseConvention, Record<ConductorName, ConductorInk>>> = {
  light: {
    'north-american': {
      A: { stroke: '#1A1A1A' },
      B: { stroke: '#C62828' },
      C: { stroke: '#1F4FB8' },
      N: { stroke: '#FFFFFF', casing: '#5E6870' },
      PE: { stroke: '#2E7D32' },
    },
    'iec-60445': {
      A: { stroke: '#7B4A26' },
      B: { stroke: '#1A1A1A' },
      C: { stroke: '#8A8F93' },
      N: { stroke: '#2F6FD0' },
      PE: { stroke: '#2E8B3A', stripe: '#E3C515' },
    },
  },
  dark: {
    'north-american': {
      A: { stroke: '#1A1A1A', casing: '#B9C0C6' },
      B: { stroke: '#EF5350' },
      C: { stroke: '#5C8DF0' },
      N: { stroke: '#FFFFFF' },
      PE: { stroke: '#4CAF50' },
    },
    'iec-60445': {
      A: { stroke: '#A0673C' },
      B: { stroke: '#1A1A1A', casing: '#B9C0C6' },
      C: { stroke: '#A3A9AD' },
      N: { stroke: '#5C8DF0' },
      PE: { stroke: '#43A047', stripe: '#F2D027' },
    },
  },
};

/** A value tag's standing: within the standard's normal range, within the tolerable one, outside both, or none. */
export type TagStandingName = 'normal' | 'tolerable' | 'outside' | 'plain';

export interface StandingLook {
  fill: string;
  stroke: string;
  text: string;
  /** Plain words for the legend. */
  word: string;
}

// Our own tints; each standing also has its own tag outline (see components/canvas/tag-shapes.ts) so that the
// standing reads without colour.
export const standingLook: Record<'light' | 'dark', Record<TagStandingName, StandingLook>> = {
  light: {
    normal: { fill: '#E3F0E4', stroke: '#2E6B3A', text: '#173A1F', word: 'Normal range' },
    tolerable: { fill: '#FBEFCF', stroke: '#A36A00', text: '#4A3200', word: 'Tolerable range' },
    outside: { fill: '#F8DCD7', stroke: '#A2332B', text: '#5A130E', word: 'Outside both' },
    plain: { fill: '#FFFCF5', stroke: '#B9AE96', text: '#1E2830', word: 'No range' },
  },
  dark: {
    normal: { fill: '#1E3A26', stroke: '#7CC48A', text: '#D8F0DC', word: 'Normal range' },
    tolerable: { fill: '#3D3115', stroke: '#E0A84A', text: '#F7E6C2', word: 'Tolerable range' },
    outside: { fill: '#462320', stroke: '#E57D72', text: '#FBDAD5', word: 'Outside both' },
    plain: { fill: '#1B242C', stroke: '#44535F', text: '#E7E2D6', word: 'No range' },
  },
};
