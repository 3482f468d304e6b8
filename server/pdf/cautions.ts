/**
 * What the sheet says about its own limits. The four cautions themselves are the product's one list
 * in shared/cautions.ts (the app shows the same sentences).
 */
import { CAUTION_SENTENCES } from '../../shared/cautions';

/** The four cautions every Sightfan sheet carries, in the order the app shows them. */
export const SHEET_CAUTIONS: readonly string[] = CAUTION_SENTENCES;

/** What the sheet does not promise, said once in plain words for a buyer. */
export const SHEET_LIMITS =
  'This sheet states what the mirrors show by calculation from the dimensions entered. It is not a certificate of compliance and does not replace a site check, a risk assessment or the judgement of a licensed professional.';
