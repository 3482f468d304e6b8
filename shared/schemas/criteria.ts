import { z } from 'zod';

/**
 * What a zone asks of the mirrors: that a person in it can be *detected* (noticed at all) or
 * *recognised* (made out), each a smallest angle the person's height must subtend at the eye
 * through the mirror. The angles are engineering judgement, not a published rule: see
 * docs/sources.md, "Detect and recognise".
 */
export const criterionKinds = ['detect', 'recognise'] as const;
export type CriterionKind = (typeof criterionKinds)[number];
export const criterionKind = z.enum(criterionKinds, { message: 'Choose detect or recognise.' });

/** One minute of arc in radians (π/10 800); kept here too so the schemas need nothing from the engine. */
const ARCMIN = Math.PI / 10800;

/** Default angles, radians: about 6′ of a person's height to detect, about 20′ to recognise (from memory). */
export const DEFAULT_CRITERIA_RAD = { detectRad: 6 * ARCMIN, recogniseRad: 20 * ARCMIN } as const;

/**
 * Range a project may set either angle in, radians: 1′ (the resolution of normal acuity, below
 * which nothing is seen at all) to 2° (a person that big is close enough to see without a mirror).
 */
export const CRITERION_LIMITS_RAD = { min: 1 * ARCMIN, max: 120 * ARCMIN } as const;

const criterionAngle = (what: string) =>
  z
    .number({ message: `Enter the ${what} angle.` })
    .finite(`Enter the ${what} angle as a number.`)
    .min(CRITERION_LIMITS_RAD.min, `The ${what} angle must be at least 1 minute of arc, the limit of normal eyesight.`)
    .max(CRITERION_LIMITS_RAD.max, `The ${what} angle must be at most 2° (120 minutes of arc).`);

/** The project's two criteria, radians. Stored inside the project's scene JSON. */
export const criteriaSettings = z
  .object({
    detectRad: criterionAngle('detect'),
    recogniseRad: criterionAngle('recognise'),
  })
  .strict()
  .refine((c) => c.detectRad < c.recogniseRad, {
    message: 'Recognising a person needs a larger angle than noticing them: make the recognise angle larger than the detect angle.',
    path: ['recogniseRad'],
  });
export type CriteriaSettings = z.infer<typeof criteriaSettings>;
