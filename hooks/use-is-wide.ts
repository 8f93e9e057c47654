import { useWindowDimensions } from 'react-native';
import { layout } from '../constants/theme';

/** True from the width where the app switches to the sidebar layout. */
export function useIsWide(): boolean {
  return useWindowDimensions().width >= layout.wideMinWidthPx;
}
