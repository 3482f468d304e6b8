/**
 * The web's faces: declared with `@font-face` and `font-display: swap` as the app starts, never
 * waited for. The screens draw at once in the fallback faces that follow each family in
 * constants/theme.ts, and the browser fetches a face only when text on the screen uses it (the
 * monospace faces only where numbers are set in them); the main face is preloaded by index.html
 * (scripts/web-finish.ts). Same files and names as the native app (app-fonts.ts).
 */
import { Asset } from 'expo-asset';
import { fontFaces } from './theme';

export const fontFiles = {
  [fontFaces.regular]: require('@/assets/fonts/Barlow-Regular.ttf'),
  [fontFaces.medium]: require('@/assets/fonts/Barlow-Medium.ttf'),
  [fontFaces.semibold]: require('@/assets/fonts/Barlow-SemiBold.ttf'),
  [fontFaces.bold]: require('@/assets/fonts/Barlow-Bold.ttf'),
  [fontFaces.mono]: require('@/assets/fonts/JetBrainsMono-Regular.ttf'),
  [fontFaces.monoMedium]: require('@/assets/fonts/JetBrainsMono-Medium.ttf'),
};

const STYLE_ID = 'sightfan-fonts';

/** The `@font-face` rules for the faces (exported for the test). */
export function fontFaceCss(): string {
  return Object.entries(fontFiles)
    .map(([family, file]) => {
      const uri = Asset.fromModule(file).uri;
      return `@font-face{font-family:${JSON.stringify(family)};src:url(${JSON.stringify(uri)}) format("truetype");font-display:swap}`;
    })
    .join('\n');
}

function declareFaces(): void {
  if (typeof document === 'undefined' || document.getElementById(STYLE_ID)) return;
  const style = document.createElement('style');
  style.id = STYLE_ID;
  style.textContent = fontFaceCss();
  document.head.appendChild(style);
}

/** Always true: nothing waits for a face on the web. */
export function useAppFonts(): boolean {
  declareFaces();
  return true;
}
