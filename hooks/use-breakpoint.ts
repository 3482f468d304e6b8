import { useWindowDimensions } from 'react-native';
import { layout } from '@/constants/theme';

/** True from the width where the shell switches to a side rail and lists become tables. */
export function useIsWide(): boolean {
  const { width } = useWindowDimensions();
  return width >= layout.wideFrom;
}
