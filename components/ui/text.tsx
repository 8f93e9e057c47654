/** Text in the theme's type scale and tones. */
import { Text as RNText, type TextProps } from 'react-native';
import { palette, type as typeScale } from '../../constants/theme';

type Variant = keyof typeof typeScale;
type Tone = 'ink' | 'soft' | 'muted' | 'pass' | 'fail' | 'caution' | 'accent' | 'copper' | 'onInk' | 'onInkMuted';

const toneColor: Record<Tone, string> = {
  ink: palette.ink,
  soft: palette.inkSoft,
  muted: palette.inkMuted,
  pass: palette.pass,
  fail: palette.fail,
  caution: palette.caution,
  accent: palette.accent,
  /** @deprecated Use 'accent'. */
  copper: palette.accent,
  onInk: palette.onInk,
  onInkMuted: palette.onInkMuted,
};

export function Text({ variant = 'body', tone = 'ink', style, ...rest }: TextProps & { variant?: Variant; tone?: Tone }) {
  return <RNText {...rest} style={[typeScale[variant], { color: toneColor[tone] }, style]} />;
}
