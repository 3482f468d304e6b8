/**
 * The four cautions every Sightfan sheet carries (PRODUCT.md, "Cautions the product always carries"),
 * in the words of the product brief. The app keeps the same sentences in components/ui/safety-cautions.tsx;
 * the server cannot import React Native code, so the sheet holds its own copy.
 */
export const SHEET_CAUTIONS: readonly string[] = [
  'Objects in a convex mirror appear smaller and farther away than they are; judge speed and gaps with care.',
  'A mirror supplements direct sight, procedures and other safety measures; it replaces none of them.',
  'Mounting height, clearances and required fields of view are set by local vehicle, road, building and workplace-safety codes, which take precedence; check with the authority or a licensed professional before relying on this sheet.',
  'Computed coverage assumes the dimensions entered; verify on site with a person walking the zone.',
];

/** What the sheet does not promise, said once in plain words for a buyer. */
export const SHEET_LIMITS =
  'This sheet states what the mirrors show by calculation from the dimensions entered. It is not a certificate of compliance and does not replace a site check, a risk assessment or the judgement of a licensed professional.';
