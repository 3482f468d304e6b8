import { z } from 'zod';
import { printable } from './common';

/** Shapes the catalogue sells; the engine's `Mirror` is built from these fields (see mirrorOfItem). */
export const mirrorShapes = ['round', 'rect', 'dome'] as const;
export const domePortions = ['full', 'half', 'quarter'] as const;

const metres = (what: string, min: number, max: number) =>
  z
    .number({ message: `Enter the ${what}.` })
    .finite(`Enter the ${what} as a number.`)
    .min(min, `The ${what} must be at least ${min * 1000} mm.`)
    .max(max, `The ${what} must be at most ${max * 1000} mm.`);

/** A convex mirror as the engine needs it, stored in SI. Custom mirrors on a placement use the same shape. */
export const mirrorSpec = z.discriminatedUnion(
  'shape',
  [
    z.object({ shape: z.literal('round'), diameterM: metres('diameter', 0.05, 3), radiusM: metres('radius of curvature', 0.05, 50) }),
    z.object({
      shape: z.literal('rect'),
      widthM: metres('width', 0.05, 3),
      heightM: metres('height', 0.05, 3),
      radiusM: metres('radius of curvature', 0.05, 50),
    }),
    z.object({ shape: z.literal('dome'), portion: z.enum(domePortions, { message: 'Choose a full, half or quarter dome.' }), diameterM: metres('diameter', 0.1, 3) }),
  ],
  { message: 'Choose a shape: round, rectangular or dome.' },
);
export type MirrorSpec = z.infer<typeof mirrorSpec>;

/** The sphere's radius must exceed the half-aperture, or the panel could not be cut from it. */
export function mirrorSpecProblem(m: MirrorSpec): { field: string; message: string } | null {
  if (m.shape === 'round' && m.diameterM >= 2 * m.radiusM) {
    return { field: 'radiusM', message: 'The radius of curvature must be more than half the diameter: no sphere that small has a cap this wide.' };
  }
  if (m.shape === 'rect' && Math.hypot(m.widthM, m.heightM) >= 2 * m.radiusM) {
    return { field: 'radiusM', message: 'The radius of curvature must be more than half the panel diagonal: no sphere that small has a panel this large.' };
  }
  return null;
}

export const checkedMirrorSpec = mirrorSpec.superRefine((m, ctx) => {
  const p = mirrorSpecProblem(m);
  if (p) ctx.addIssue({ code: 'custom', path: [p.field], message: p.message });
});

const catalogueFields = {
  code: z.string({ message: 'Enter a catalogue code.' }).trim().min(1, 'Enter a catalogue code.').max(40, 'Keep the code to 40 characters.').regex(/^[A-Za-z0-9._-]+$/, 'Use letters, digits, dot, dash or underscore in the code.'),
  name: printable(z.string({ message: 'Enter a name.' }).trim().min(1, 'Enter a name.').max(160, 'Keep the name to 160 characters.')),
  mirror: checkedMirrorSpec,
  material: printable(z.string().trim().max(80, 'Keep the material to 80 characters.')),
  reflectance: z.number({ message: 'Enter the reflectance as a fraction, like 0.8.' }).min(0.04, 'Reflectance below 4 % is not a mirror.').max(1, 'Reflectance cannot exceed 100 %.').nullable(),
  massKg: z.number({ message: 'Enter the mass in kilograms.' }).positive('The mass must be more than zero.').max(200, 'The mass must be at most 200 kg.').nullable(),
  /** Price in the currency's minor unit (cents), so sums are exact. */
  unitPriceMinor: z.number({ message: 'Enter a price.' }).int('Enter the price in whole cents.').min(0, 'The price cannot be negative.').max(100_000_000, 'That price is too high.'),
  currency: z.string({ message: 'Enter a currency code.' }).trim().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code, like EUR or USD.'),
  notes: z.string().max(2000, 'Keep the notes to 2,000 characters.'),
  active: z.boolean(),
};

/** Catalogue fields without defaults (a PATCH must not reset what it did not mention). */
export const createCatalogueItemBody = z
  .object({
    ...catalogueFields,
    material: catalogueFields.material.default(''),
    reflectance: catalogueFields.reflectance.default(null),
    massKg: catalogueFields.massKg.default(null),
    notes: catalogueFields.notes.default(''),
    active: catalogueFields.active.default(true),
  })
  .strict();
export type CreateCatalogueItemBody = z.input<typeof createCatalogueItemBody>;
export const patchCatalogueItemBody = z
  .object({ ...catalogueFields, version: z.number().int() })
  .partial()
  .required({ version: true })
  .strict();
export type PatchCatalogueItemBody = z.input<typeof patchCatalogueItemBody>;

export const catalogueItemDto = z.object({
  id: z.number(),
  code: z.string(),
  name: z.string(),
  mirror: mirrorSpec,
  material: z.string(),
  reflectance: z.number().nullable(),
  massKg: z.number().nullable(),
  unitPriceMinor: z.number(),
  currency: z.string(),
  notes: z.string(),
  active: z.boolean(),
  demo: z.boolean(),
  version: z.number(),
  updatedAt: z.string(),
});
export type CatalogueItemDto = z.infer<typeof catalogueItemDto>;
