/**
 * Fieldfile's one theme: palette, type, spacing, radii and layout breakpoints. Screens read
 * from here only, so the look changes in one place.
 */
import { Platform, type TextStyle } from 'react-native';

export const palette = {
  /** Deep slate-blue: text, the sidebar, primary buttons. */
  ink: '#1F3A4D',
  inkSoft: '#3E5668',
  inkMuted: '#66788A',
  inkFaint: '#8F9DAA',
  /** Warm paper: the page behind surfaces. */
  paper: '#F5F3EE',
  paperDeep: '#ECE8DF',
  surface: '#FFFFFF',
  line: '#DDD8CD',
  lineStrong: '#C7C0B1',
  /** Copper: the one accent (focus, active navigation, the mark). */
  copper: '#B8652A',
  copperSoft: '#F6E9DE',
  pass: '#2E6B4F',
  passSoft: '#E3EFE8',
  fail: '#A33A32',
  failSoft: '#F6E3E1',
  caution: '#8A6100',
  cautionSoft: '#F5ECD6',
  /** Text and lines on the ink sidebar. */
  onInk: '#F5F3EE',
  onInkMuted: '#A9B8C4',
  inkRaised: '#2A4A60',
} as const;

/** Font families as registered by useFonts in app/_layout.tsx; one family per weight. */
export const fonts = {
  regular: 'PlexSans-Regular',
  medium: 'PlexSans-Medium',
  semibold: 'PlexSans-SemiBold',
  bold: 'PlexSans-Bold',
  mono: 'PlexMono-Regular',
  monoMedium: 'PlexMono-Medium',
} as const;

/** Type scale (px). Sizes step by about 1.2; line heights stay on a 4 px grid. */
export const type = {
  display: { fontFamily: fonts.semibold, fontSize: 28, lineHeight: 36, letterSpacing: -0.3 },
  title: { fontFamily: fonts.semibold, fontSize: 22, lineHeight: 28, letterSpacing: -0.2 },
  heading: { fontFamily: fonts.semibold, fontSize: 17, lineHeight: 24 },
  body: { fontFamily: fonts.regular, fontSize: 15, lineHeight: 22 },
  bodyStrong: { fontFamily: fonts.medium, fontSize: 15, lineHeight: 22 },
  small: { fontFamily: fonts.regular, fontSize: 13, lineHeight: 18 },
  smallStrong: { fontFamily: fonts.medium, fontSize: 13, lineHeight: 18 },
  label: { fontFamily: fonts.semibold, fontSize: 12, lineHeight: 16, letterSpacing: 0.6, textTransform: 'uppercase' },
  /** Figures: tabular mono, right-aligned in tables, always with a unit beside them. */
  figure: { fontFamily: fonts.mono, fontSize: 14, lineHeight: 20, textAlign: 'right' },
  mono: { fontFamily: fonts.mono, fontSize: 13, lineHeight: 20 },
} satisfies Record<string, TextStyle>;

/** Spacing on a 4 px grid. */
export const space = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;

export const radii = { sm: 4, md: 8, lg: 12, pill: 999 } as const;

export const layout = {
  /** From this width the app shows a sidebar beside the content instead of a bottom bar. */
  wideMinWidthPx: 1024,
  sidebarWidthPx: 248,
  contentMaxWidthPx: 960,
  formMaxWidthPx: 440,
  /** Smallest touch target (WCAG 2.5.5 / common platform guidance). */
  touchMinPx: 44,
  bottomBarHeightPx: 64,
} as const;

export const shadow = Platform.select({
  web: { boxShadow: '0 1px 2px rgba(31, 58, 77, 0.06), 0 1px 1px rgba(31, 58, 77, 0.04)' },
  default: { shadowColor: palette.ink, shadowOpacity: 0.06, shadowRadius: 2, shadowOffset: { width: 0, height: 1 } },
}) as object;

export const theme = { palette, fonts, type, space, radii, layout, shadow } as const;
