import { z } from 'zod';
import {
  catalogueRules,
  DOME_PORTION_MESSAGE,
  MIRROR_SHAPE_MESSAGE,
  MIRROR_SIZES,
  mirrorSizeProblem,
  sizeRule,
  type SizeLimit,
} from './rules';
import { zodNumber, zodText } from './zod-rules';

/** Shapes the catalogue sells; the engine's `Mirror` is built from these fields (see mirrorOfItem). */
export const mirrorShapes = ['round', 'rect', 'dome'] as const;
export const domePortions = ['full', 'half', 'quarter'] as const;

/** The API speaks metric: limits are said in millimetres. */
const metres = (size: SizeLimit) => zodNumber(sizeRule(size, 'metric'));

/** A convex mirror as the engine needs it, stored in SI. Custom mirrors on a placement use the same shape. */
export const mirrorSpec = z.discriminatedUnion(
  'shape',
  [
    z.object({ shape: z.literal('round'), diameterM: metres(MIRROR_SIZES.diameter), radiusM: metres(MIRROR_SIZES.radius) }),
    z.object({
      shape: z.literal('rect'),
      widthM: metres(MIRROR_SIZES.width),
      heightM: metres(MIRROR_SIZES.height),
      radiusM: metres(MIRROR_SIZES.radius),
    }),
    z.object({
      shape: z.literal('dome'),
      portion: z.enum(domePortions, { message: DOME_PORTION_MESSAGE }),
      diameterM: metres(MIRROR_SIZES.domeDiameter),
    }),
  ],
  { message: MIRROR_SHAPE_MESSAGE },
);
export type MirrorSpec = z.infer<typeof mirrorSpec>;

export const checkedMirrorSpec = mirrorSpec.superRefine((m, ctx) => {
  const p = mirrorSizeProblem(m);
  if (p) ctx.addIssue({ code: 'custom', path: [p.field], message: p.message });
});

const catalogueFields = {
  code: zodText(catalogueRules.code),
  name: zodText(catalogueRules.name),
  mirror: checkedMirrorSpec,
  material: zodText(catalogueRules.material),
  reflectance: zodNumber(catalogueRules.reflectance).nullable(),
  massKg: zodNumber(catalogueRules.massKg).nullable(),
  /** Price in the currency's minor unit (cents), so sums are exact. */
  unitPriceMinor: zodNumber(catalogueRules.unitPriceMinor),
  currency: zodText(catalogueRules.currency),
  notes: zodText(catalogueRules.notes),
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
