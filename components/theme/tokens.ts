// Phasewright's design tokens: two grounds (drafting paper by day, deep slate for a dim plant room), one spacing
// scale, radii and a type scale. Colours are our own; phase colours are chosen per sheet and live elsewhere.

export interface Palette {
  /** The page ground: warm drafting paper, or deep slate. */
  ground: string;
  /** Cards, sheets and fields sit on this. */
  surface: string;
  /** Pressed rows, the bottom bar, the header. */
  raised: string;
  ink: string;
  inkMuted: string;
  inkFaint: string;
  line: string;
  lineStrong: string;
  primary: string;
  primaryPressed: string;
  onPrimary: string;
  danger: string;
  dangerPressed: string;
  onDanger: string;
  dangerSoft: string;
  success: string;
  focus: string;
  scrim: string;
  link: string;
}

export const light: Palette = {
  ground: '#F4EFE3',
  surface: '#FFFCF5',
  raised: '#EBE4D4',
  ink: '#1E2830',
  inkMuted: '#4F5B64',
  inkFaint: '#7C858B',
  line: '#DCD3BF',
  lineStrong: '#B9AE96',
  primary: '#1F5673',
  primaryPressed: '#173F55',
  onPrimary: '#FFFFFF',
  danger: '#A2332B',
  dangerPressed: '#7E2620',
  onDanger: '#FFFFFF',
  dangerSoft: '#F6E2DC',
  success: '#2E6B3A',
  focus: '#C4861B',
  scrim: 'rgba(30, 40, 48, 0.45)',
  link: '#1F5673',
};

export const dark: Palette = {
  ground: '#131A20',
  surface: '#1B242C',
  raised: '#232F39',
  ink: '#E7E2D6',
  inkMuted: '#A7AFB5',
  inkFaint: '#7D878E',
  line: '#2E3B46',
  lineStrong: '#44535F',
  primary: '#7DB8D6',
  primaryPressed: '#A3CDE3',
  onPrimary: '#0D1A22',
  danger: '#E57D72',
  dangerPressed: '#F09C93',
  onDanger: '#1A0D0B',
  dangerSoft: '#3A2422',
  success: '#7CC48A',
  focus: '#E0A84A',
  scrim: 'rgba(0, 0, 0, 0.6)',
  link: '#8EC6E3',
};

/** Spacing in device-independent pixels. */
export const space = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;

export const radius = { sm: 6, md: 10, lg: 16, pill: 999 } as const;

/** Minimum size of anything pressable (the usual finger-size guidance). */
export const touchTargetMin = 44;

/** Content never runs wider than this on a wide screen; side panes use paneWidth. */
export const layout = { contentMaxWidth: 760, paneWidth: 380, phoneMax: 768, wideMin: 1024 } as const;

export const fontFamily = {
  regular: 'Inter_400Regular',
  medium: 'Inter_500Medium',
  semibold: 'Inter_600SemiBold',
  bold: 'Inter_700Bold',
  mono: 'JetBrainsMono_400Regular',
  monoMedium: 'JetBrainsMono_500Medium',
} as const;

export interface TypeStyle {
  fontFamily: string;
  fontSize: number;
  lineHeight: number;
  letterSpacing?: number;
}

export const type = {
  display: { fontFamily: fontFamily.bold, fontSize: 30, lineHeight: 36, letterSpacing: -0.4 },
  title: { fontFamily: fontFamily.semibold, fontSize: 22, lineHeight: 28, letterSpacing: -0.2 },
  heading: { fontFamily: fontFamily.semibold, fontSize: 17, lineHeight: 24 },
  body: { fontFamily: fontFamily.regular, fontSize: 16, lineHeight: 24 },
  bodyStrong: { fontFamily: fontFamily.medium, fontSize: 16, lineHeight: 24 },
  small: { fontFamily: fontFamily.regular, fontSize: 14, lineHeight: 20 },
  label: { fontFamily: fontFamily.medium, fontSize: 14, lineHeight: 20 },
  caption: { fontFamily: fontFamily.medium, fontSize: 12, lineHeight: 16, letterSpacing: 0.4 },
  number: { fontFamily: fontFamily.mono, fontSize: 14, lineHeight: 20 },
  numberLarge: { fontFamily: fontFamily.monoMedium, fontSize: 16, lineHeight: 24 },
} satisfies Record<string, TypeStyle>;

export type TypeVariant = keyof typeof type;

export interface Theme {
  scheme: 'light' | 'dark';
  color: Palette;
  space: typeof space;
  radius: typeof radius;
  type: typeof type;
}

export const themes: Record<'light' | 'dark', Theme> = {
  light: { scheme: 'light', color: light, space, radius, type },
  dark: { scheme: 'dark', color: dark, space, radius, type },
};

// ---------------------------------------------------------------------------------------------------------------
// The drawing's colours live beside the symbol geometry (shared/symbols/ink.ts): the server's exports draw with them too.
export * from '../../shared/symbols/ink';
