/**
 * The four cautions the product always carries, on every screen and sheet that shows coverage
 * (a product decision, not an outside source). The one list: the app's caution block and the PDF sheet both read it.
 * Plain data, no React, so the server can import it too.
 */
export const SAFETY_CAUTIONS = [
  {
    key: 'smaller-farther',
    text: 'Objects in a convex mirror appear smaller and farther away than they are; judge speed and gaps with care.',
  },
  {
    key: 'supplements',
    text: 'A mirror supplements direct sight, procedures and other safety measures; it replaces none of them.',
  },
  {
    key: 'codes',
    text: 'Mounting height, clearances and required fields of view are set by local vehicle, road, building and workplace-safety codes, which take precedence; check with the authority or a licensed professional before relying on a sheet.',
  },
  {
    key: 'verify',
    text: 'Computed coverage assumes the dimensions entered; verify on site with a person walking the zone.',
  },
] as const;

export type SafetyCaution = (typeof SAFETY_CAUTIONS)[number];

/** The same four sentences as plain strings, in the same order. */
export const CAUTION_SENTENCES: readonly string[] = SAFETY_CAUTIONS.map((c) => c.text);

/**
 * Said with every coverage of a vehicle's ground fields (screens and sheet), beside the cautions:
 * the encoded fields carry marks of how sure their figures are (docs/vehicle-sources.md).
 */
export const VEHICLE_FIELDS_NOTE =
  'The ground fields shown are for planning: type approval and local rules decide whether a vehicle’s mirrors comply.';

/**
 * The short caution shown whole wherever coverage is drawn but the four cautions are out of view
 * (the phone's folded drawer, the sign-in illustration): it names the first caution and where the
 * rest are. Never cut to one line.
 */
export const SHORT_CAUTION = 'Mirrors show things smaller and farther away than they are. Read the cautions under Details.';
