/** bidi-js's mirror table, for tests that compare text drawn right to left with the text given. */
import bidiFactory from 'bidi-js';

const bidi = bidiFactory();
export const getMirroredCharacter = (ch: string): string | null => bidi.getMirroredCharacter(ch);
