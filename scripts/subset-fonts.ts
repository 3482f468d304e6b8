/**
 * `npx tsx scripts/subset-fonts.ts`: writes the app's fonts as Latin subsets into assets/fonts/
 * (committed; run again when the app's text gains a character outside the set, and the test in
 * tests/shared/app-fonts.test.ts says which). The PDF embeds the full faces in fonts/, untouched.
 *
 * Kept: printable ASCII, Latin-1 and Latin Extended-A (names typed in European languages), the
 * typographic marks the app writes, and every other character found in the app's own source
 * (app/, components/, hooks/, constants/, shared/). A character a subset lacks is drawn by the
 * browser in the next face of the CSS stack, glyph by glyph, so a rarer letter in a typed name
 * still shows.
 */
import fs from 'node:fs';
import path from 'node:path';
import subsetFont from 'subset-font';

const root = path.resolve(__dirname, '..');
export const APP_FONT_FILES = [
  'Barlow-Regular.ttf',
  'Barlow-Medium.ttf',
  'Barlow-SemiBold.ttf',
  'Barlow-Bold.ttf',
  'JetBrainsMono-Regular.ttf',
  'JetBrainsMono-Medium.ttf',
] as const;
export const SUBSET_DIR = path.join(root, 'assets', 'fonts');
const SOURCE_DIRS = ['app', 'components', 'hooks', 'constants', 'shared'];

function range(from: number, to: number): string {
  let s = '';
  for (let c = from; c <= to; c++) s += String.fromCodePoint(c);
  return s;
}

/**
 * Layout features kept: kerning, standard ligatures, marks and glyph composition. Keeping every
 * feature pulled in each letter's alternates (small caps, stylistic sets) and left the files at
 * two thirds of their size. Hinting is dropped too: phone screens do not use it.
 */
const KEEP_FEATURES = ['kern', 'liga', 'ccmp', 'locl', 'mark', 'mkmk'];

/** Typographic marks and symbols the app writes or a person may type in a label. */
const MARKS = '‘’‚“”„–—…•·−×÷±°′″≤≥≈→←↑↓€£¥§¶©®™';

function sourceFiles(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(p);
    return /\.(ts|tsx)$/.test(e.name) ? [p] : [];
  });
}

/** Every character outside ASCII that the app's source holds. */
export function charactersInAppSource(): Set<string> {
  const found = new Set<string>();
  for (const dir of SOURCE_DIRS) {
    for (const file of sourceFiles(path.join(root, dir))) {
      for (const ch of fs.readFileSync(file, 'utf8')) if (ch.codePointAt(0)! > 0x7e) found.add(ch);
    }
  }
  return found;
}

/** The characters every subset keeps. */
export function subsetCharacters(): string {
  const set = new Set<string>([...range(0x20, 0x7e), ...range(0xa0, 0x17f), ...MARKS, ...charactersInAppSource()]);
  return [...set].sort().join('');
}

async function main(): Promise<void> {
  fs.mkdirSync(SUBSET_DIR, { recursive: true });
  const text = subsetCharacters();
  for (const file of APP_FONT_FILES) {
    const full = fs.readFileSync(path.join(root, 'fonts', file));
    const subset = await subsetFont(full, text, { targetFormat: 'sfnt', keepFeatures: KEEP_FEATURES, noHinting: true });
    fs.writeFileSync(path.join(SUBSET_DIR, file), subset);
    console.log(`${file}: ${(full.length / 1024).toFixed(0)} KB → ${(subset.length / 1024).toFixed(0)} KB`);
  }
  console.log(`${[...text].length} characters kept`);
}

if (require.main === module) void main();
