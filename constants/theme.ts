/**
 * Fieldfile's one theme: palette, type, spacing, radii and layout breakpoints. Screens read
 * from here only, so the look changes in one place.
 */
import { Platform, type TextStyle } from 'react-native';

export const palette = {
  /** Graphite: text, selected chips. Warm, slightly green-leaning; never a navy console. */
  ink: '#23272A',
  inkSoft: '#41484D',
  inkMuted: '#5B646A',
  inkFaint: '#8A9298',
  /** Pale field paper: the page behind surfaces, and the sidebar one step deeper. */
  paper: '#F5F4EF',
  paperDeep: '#EAE8E0',
  surface: '#FFFFFF',
  line: '#DCD9CF',
  lineStrong: '#B9B5A8',
  /** Signal violet: the one accent (primary actions, focus ring, active place, the mark). */
  accent: '#5A3E9E',
  accentStrong: '#452F7C',
  accentSoft: '#EEE9F8',
  pass: '#1E6B46',
  passSoft: '#E1EFE6',
  fail: '#A3302A',
  failSoft: '#F8E3E0',
  caution: '#835700',
  cautionSoft: '#F6ECD3',
  /** Text and icons on filled (ink or accent) surfaces. */
  onInk: '#FFFFFF',
  onInkMuted: '#DCD7EC',
  inkRaised: '#3A4146',
  /** @deprecated Old names kept while open branches rebase; use accent / accentSoft. */
  copper: '#5A3E9E',
  /** @deprecated Use accentSoft. */
  copperSoft: '#EEE9F8',
} as const;

/**
 * Font families as registered by useFonts in app/_layout.tsx; one family per weight.
 * Atkinson Hyperlegible Next (Braille Institute, SIL OFL 1.1): letterforms drawn to be told
 * apart (0/O, 1/l/I, 5/S, 8/B), with tabular figures (OpenType tnum) for columns of numbers.
 * Its Mono sibling only for identifiers and checksums.
 */
export const fonts = {
  regular: 'Atkinson-Regular',
  medium: 'Atkinson-Medium',
  semibold: 'Atkinson-SemiBold',
  mono: 'AtkinsonMono-Regular',
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
  /** Figures: tabular (equal-width) digits, right-aligned in tables, always with a unit beside them. */
  figure: { fontFamily: fonts.medium, fontSize: 14, lineHeight: 20, textAlign: 'right', fontVariant: ['tabular-nums'] },
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

/** Keyboard focus: a 3 px accent ring with a 2 px gap, on every focusable element (web). */
export const focusRing = { width: 3, offset: 2, color: palette.accent } as const;

export const shadow = Platform.select({
  web: { boxShadow: '0 1px 2px rgba(35, 39, 42, 0.06), 0 1px 1px rgba(35, 39, 42, 0.04)' },
  default: { shadowColor: palette.ink, shadowOpacity: 0.06, shadowRadius: 2, shadowOffset: { width: 0, height: 1 } },
}) as object;

export const theme = { palette, fonts, type, space, radii, layout, shadow, focusRing } as const;
