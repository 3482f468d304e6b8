/**
 * The app's Latin subsets (assets/fonts, written by scripts/subset-fonts.ts) against the full
 * faces in fonts/ that the PDF embeds: a subset must still draw every character the app's own
 * text uses, and everything a person typing a name in a western European language would, as long as
 * the full face has it. When this fails, run `npx tsx scripts/subset-fonts.ts` and commit the fonts.
 */
import fs from 'node:fs';
import path from 'node:path';
import * as fontkit from 'fontkit';
import { APP_FONT_FILES, charactersInAppSource, SUBSET_DIR } from '../../scripts/subset-fonts';

const root = path.resolve(__dirname, '../..');
const open = (file: string) => fontkit.create(fs.readFileSync(file)) as fontkit.Font;

function range(from: number, to: number): number[] {
  return Array.from({ length: to - from + 1 }, (_, i) => from + i);
}

describe('the app’s subset faces', () => {
  const appCharacters = [...charactersInAppSource()].map((c) => c.codePointAt(0)!);
  // Printable ASCII, Latin-1 and Latin Extended-A: what names in the languages of western, central
  // and northern Europe are written with (the Unicode blocks; common practice for a "Latin" subset).
  const typed = [...range(0x20, 0x7e), ...range(0xa0, 0x17f)];

  it.each(APP_FONT_FILES)('%s draws every character of the app’s own text that the full face draws', (file) => {
    const full = open(path.join(root, 'fonts', file));
    const subset = open(path.join(SUBSET_DIR, file));
    const missing = appCharacters.filter((cp) => full.hasGlyphForCodePoint(cp) && !subset.hasGlyphForCodePoint(cp));
    expect(missing.map((cp) => String.fromCodePoint(cp))).toEqual([]);
  });

  it.each(APP_FONT_FILES)('%s draws every Latin letter and mark a typed name may hold that the full face draws', (file) => {
    const full = open(path.join(root, 'fonts', file));
    const subset = open(path.join(SUBSET_DIR, file));
    const missing = typed.filter((cp) => full.hasGlyphForCodePoint(cp) && !subset.hasGlyphForCodePoint(cp));
    expect(missing.map((cp) => String.fromCodePoint(cp))).toEqual([]);
  });

  it.each(APP_FONT_FILES)('%s keeps the face’s name, so the app’s family names still find it', (file) => {
    expect(open(path.join(SUBSET_DIR, file)).postscriptName).toBe(open(path.join(root, 'fonts', file)).postscriptName);
  });
});
