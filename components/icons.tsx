/** Line icons drawn for Fieldfile on a 24 px grid (react-native-svg, so they render on web too). */
import Svg, { Circle, Path, Rect } from 'react-native-svg';
import { palette } from '../constants/theme';

export interface IconProps {
  size?: number;
  color?: string;
  strokeWidth?: number;
}

type Drawing = (color: string) => React.ReactNode;

const drawings = {
  filings: (c) => (
    <>
      <Path d="M6 3h8l4 4v14H6z" stroke={c} fill="none" strokeLinejoin="round" />
      <Path d="M14 3v4h4M9 12h6M9 15.5h6M9 19h3.5" stroke={c} fill="none" strokeLinecap="round" strokeLinejoin="round" />
    </>
  ),
  people: (c) => (
    <>
      <Circle cx={9} cy={8.5} r={3.2} stroke={c} fill="none" />
      <Path d="M3.5 19.5c.6-3.2 2.8-5 5.5-5s4.9 1.8 5.5 5" stroke={c} fill="none" strokeLinecap="round" />
      <Path d="M15.5 5.6a3 3 0 0 1 0 5.8M17.3 14.8c1.7.6 2.9 2.2 3.2 4.7" stroke={c} fill="none" strokeLinecap="round" />
    </>
  ),
  outbox: (c) => (
    <>
      <Rect x={3} y={5.5} width={18} height={13} rx={1.5} stroke={c} fill="none" />
      <Path d="M3.5 6.5 12 13l8.5-6.5" stroke={c} fill="none" strokeLinejoin="round" />
    </>
  ),
  activity: (c) => (
    <>
      <Circle cx={12} cy={12} r={8.5} stroke={c} fill="none" />
      <Path d="M12 7.5V12l3 2" stroke={c} fill="none" strokeLinecap="round" strokeLinejoin="round" />
    </>
  ),
  profile: (c) => (
    <>
      <Circle cx={12} cy={8.5} r={3.5} stroke={c} fill="none" />
      <Path d="M5 20c.8-3.6 3.6-5.6 7-5.6s6.2 2 7 5.6" stroke={c} fill="none" strokeLinecap="round" />
    </>
  ),
  check: (c) => <Path d="m5 12.5 4.5 4.5L19 7.5" stroke={c} fill="none" strokeLinecap="round" strokeLinejoin="round" />,
  cross: (c) => <Path d="m6.5 6.5 11 11M17.5 6.5l-11 11" stroke={c} fill="none" strokeLinecap="round" />,
  pending: (c) => (
    <>
      <Circle cx={12} cy={12} r={8.5} stroke={c} fill="none" strokeDasharray="3 2.6" />
      <Path d="M12 8v4.5h3.5" stroke={c} fill="none" strokeLinecap="round" strokeLinejoin="round" />
    </>
  ),
  blocked: (c) => (
    <>
      <Circle cx={12} cy={12} r={8.5} stroke={c} fill="none" />
      <Path d="m6 6 12 12" stroke={c} fill="none" strokeLinecap="round" />
    </>
  ),
  warning: (c) => (
    <>
      <Path d="M12 3.5 21 19.5H3z" stroke={c} fill="none" strokeLinejoin="round" />
      <Path d="M12 10v4.2" stroke={c} fill="none" strokeLinecap="round" />
      <Circle cx={12} cy={16.9} r={0.6} stroke={c} fill={c} />
    </>
  ),
  info: (c) => (
    <>
      <Circle cx={12} cy={12} r={8.5} stroke={c} fill="none" />
      <Path d="M12 11v5.5" stroke={c} fill="none" strokeLinecap="round" />
      <Circle cx={12} cy={7.8} r={0.6} stroke={c} fill={c} />
    </>
  ),
  lock: (c) => (
    <>
      <Rect x={5} y={10.5} width={14} height={10} rx={1.5} stroke={c} fill="none" />
      <Path d="M8 10.5V8a4 4 0 0 1 8 0v2.5" stroke={c} fill="none" />
    </>
  ),
  signOut: (c) => (
    <>
      <Path d="M10 4.5H5.5v15H10" stroke={c} fill="none" strokeLinecap="round" strokeLinejoin="round" />
      <Path d="M14.5 8 19 12l-4.5 4M19 12H9.5" stroke={c} fill="none" strokeLinecap="round" strokeLinejoin="round" />
    </>
  ),
  chevronRight: (c) => <Path d="m9.5 6 6 6-6 6" stroke={c} fill="none" strokeLinecap="round" strokeLinejoin="round" />,
  chevronLeft: (c) => <Path d="m14.5 6-6 6 6 6" stroke={c} fill="none" strokeLinecap="round" strokeLinejoin="round" />,
  chevronDown: (c) => <Path d="m6 9.5 6 6 6-6" stroke={c} fill="none" strokeLinecap="round" strokeLinejoin="round" />,
  plus: (c) => <Path d="M12 5v14M5 12h14" stroke={c} fill="none" strokeLinecap="round" />,
  link: (c) => <Path d="M10.5 13.5a3.5 3.5 0 0 0 5 0l3-3a3.5 3.5 0 0 0-5-5l-1 1M13.5 10.5a3.5 3.5 0 0 0-5 0l-3 3a3.5 3.5 0 0 0 5 5l1-1" stroke={c} fill="none" strokeLinecap="round" />,
} satisfies Record<string, Drawing>;

export type IconName = keyof typeof drawings;

export function Icon({ name, size = 20, color = palette.ink, strokeWidth = 1.7 }: IconProps & { name: IconName }) {
  return (
    <Svg width={size} height={size} viewBox="0 0 24 24" strokeWidth={strokeWidth} accessibilityElementsHidden importantForAccessibility="no-hide-descendants">
      {drawings[name](color)}
    </Svg>
  );
}
