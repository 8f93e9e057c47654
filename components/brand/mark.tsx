/** Fieldfile's mark: a filed sheet with a field radiating from its corner. */
import Svg, { Circle, Path } from 'react-native-svg';
import { palette } from '../../constants/theme';

export type BrandTone = 'onPaper' | 'onInk';

export function Mark({ size = 28, tone = 'onPaper' }: { size?: number; tone?: BrandTone }) {
  const sheet = tone === 'onInk' ? palette.onInk : palette.ink;
  const fill = tone === 'onInk' ? palette.ink : palette.surface;
  return (
    <Svg width={size} height={size} viewBox="0 0 32 32" accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      <Path d="M7 2.5h12.5L26 9v20.5H7z" fill={fill} stroke={sheet} strokeWidth={2} strokeLinejoin="round" />
      <Path d="M19.5 2.5V9H26" fill="none" stroke={sheet} strokeWidth={2} strokeLinejoin="round" />
      <Path d="M13.25 16.32a3.5 3.5 0 0 1 0 5.36" fill="none" stroke={palette.accent} strokeWidth={2} strokeLinecap="round" />
      <Path d="M15.18 14.02a6.5 6.5 0 0 1 0 9.96" fill="none" stroke={palette.accent} strokeWidth={2} strokeLinecap="round" />
      <Path d="M17.11 11.72a9.5 9.5 0 0 1 0 14.56" fill="none" stroke={palette.accent} strokeWidth={2} strokeLinecap="round" opacity={0.55} />
      <Circle cx={11} cy={19} r={1.9} fill={palette.accent} />
    </Svg>
  );
}
