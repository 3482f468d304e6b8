/**
 * Sightfan's one theme, "Yardlight": dark asphalt ink on chalk paper, with a sodium-amber beacon for the
 * one thing to press. Chosen for a bright loading dock: every text/background pair here is at least
 * 7:1 except `haze` on `chalk` (about 6.6:1, still above WCAG AA for body text).
 */
/** The colours live in shared/palette.ts, so the screens and the specification sheet use the same ones. */
import { Platform } from 'react-native';
import { palette } from '@/shared/palette';

export { palette };

export const spacing = { xxs: 2, xs: 4, sm: 8, md: 12, lg: 16, xl: 24, xxl: 32, xxxl: 48 } as const;

export const radii = { sm: 6, md: 10, lg: 16, pill: 999 } as const;

/** Face names as registered (constants/app-fonts.ts): one family per weight, so no faux bold. */
export const fontFaces = {
  regular: 'Barlow-Regular',
  medium: 'Barlow-Medium',
  semibold: 'Barlow-SemiBold',
  bold: 'Barlow-Bold',
  mono: 'JetBrainsMono-Regular',
  monoMedium: 'JetBrainsMono-Medium',
} as const;

/**
 * What styles set as `fontFamily`. On the web each face is followed by system faces, drawn while
 * it loads (`font-display: swap`) and for a character its Latin subset lacks; native gets the face alone.
 */
const withFallback = (face: string, fallback: string): string => (Platform.OS === 'web' ? `${face}, ${fallback}` : face);
const SANS = 'system-ui, -apple-system, "Segoe UI", Roboto, Arial, sans-serif';
const MONO = 'ui-monospace, Menlo, Consolas, "DejaVu Sans Mono", monospace';
export const fonts = {
  regular: withFallback(fontFaces.regular, SANS),
  medium: withFallback(fontFaces.medium, SANS),
  semibold: withFallback(fontFaces.semibold, SANS),
  bold: withFallback(fontFaces.bold, SANS),
  mono: withFallback(fontFaces.mono, MONO),
  monoMedium: withFallback(fontFaces.monoMedium, MONO),
};

/** Large on purpose: the installer reads this at arm's length in daylight. */
export const type = {
  display: { fontFamily: fonts.bold, fontSize: 34, lineHeight: 40 },
  title: { fontFamily: fonts.bold, fontSize: 28, lineHeight: 34 },
  heading: { fontFamily: fonts.semibold, fontSize: 21, lineHeight: 28 },
  body: { fontFamily: fonts.regular, fontSize: 17, lineHeight: 25 },
  bodyStrong: { fontFamily: fonts.semibold, fontSize: 17, lineHeight: 25 },
  label: { fontFamily: fonts.semibold, fontSize: 16, lineHeight: 22 },
  small: { fontFamily: fonts.medium, fontSize: 15, lineHeight: 21 },
  caps: { fontFamily: fonts.semibold, fontSize: 13, lineHeight: 18, letterSpacing: 1.2, textTransform: 'uppercase' as const },
  mono: { fontFamily: fonts.mono, fontSize: 15, lineHeight: 22 },
} as const;

export const layout = {
  /** Smallest touch target, per the phone-first rule. */
  minTarget: 48,
  /** From this width the shell shows a side rail instead of bottom tabs, and lists become tables. */
  wideFrom: 1024,
  /** Readable line length for forms and text on a wide screen. */
  contentMaxWidth: 960,
  formMaxWidth: 480,
  railWidth: 248,
} as const;

/** Keyboard focus: a thick steel-blue ring, visible on chalk, white and asphalt alike. */
export const focusRing = { outlineStyle: 'solid', outlineWidth: 3, outlineColor: palette.glass, outlineOffset: 2 } as const;

/** A low lift for cards; boxShadow is understood by both react-native-web and React Native ≥ 0.76. */
export const shadow = { boxShadow: '0 1px 2px rgba(20,32,43,0.10), 0 2px 10px rgba(20,32,43,0.06)' } as const;
