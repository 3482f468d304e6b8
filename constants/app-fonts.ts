/**
 * The app's faces: Latin subsets of the fonts in fonts/ (scripts/subset-fonts.ts writes them into
 * assets/fonts/; the PDF keeps the full faces), registered under the names in `fontFaces`.
 * Native: the faces load before the first screen, since a native text view has no fallback for
 * a family that is not registered yet. The web has its own file (app-fonts.web.ts).
 */
import { useFonts } from 'expo-font';
import { fontFaces } from './theme';

export const fontFiles = {
  [fontFaces.regular]: require('@/assets/fonts/Barlow-Regular.ttf'),
  [fontFaces.medium]: require('@/assets/fonts/Barlow-Medium.ttf'),
  [fontFaces.semibold]: require('@/assets/fonts/Barlow-SemiBold.ttf'),
  [fontFaces.bold]: require('@/assets/fonts/Barlow-Bold.ttf'),
  [fontFaces.mono]: require('@/assets/fonts/JetBrainsMono-Regular.ttf'),
  [fontFaces.monoMedium]: require('@/assets/fonts/JetBrainsMono-Medium.ttf'),
};

/** True once the screens may be drawn (the faces loaded, or failed and system type is used). */
export function useAppFonts(): boolean {
  const [loaded, error] = useFonts(fontFiles);
  return loaded || error !== null;
}
