import { z } from 'zod';
import { unitSystem } from './common';
import { checkedMirrorSpec } from './catalogue';
import { isSimpleRing } from '../geometry/polygon';
import { LIMIT_MESSAGES, PLACEMENT_LIMITS, SCENE_LIMITS } from './limits';
import { criteriaSettings, criterionKind } from './criteria';
import { labelRule, mountingHeightRule, placementRules, planCoordinateRule, projectRules } from './rules';
import { zodNumber, zodText } from './zod-rules';
import { mirrorClass, vehicle, vehicleRuleSet } from './vehicle';
import { reviewFieldsDto } from './review';
import { underlay } from './files';

const coord = zodNumber(planCoordinateRule('metric'));
const pair = z.tuple([coord, coord], { message: 'A point needs x and y.' });
const sceneId = z
  .string()
  .min(1)
  .max(40)
  .regex(/^[A-Za-z0-9_-]+$/, 'Ids use letters, digits, dash or underscore.');
const label = (what: string) => zodText(labelRule(what));

export const wallKinds = ['wall', 'racking', 'door'] as const;
export const wall = z
  .object({
    id: sceneId,
    kind: z.enum(wallKinds).default('wall'),
    aM: pair,
    bM: pair,
    heightM: z
      .number({ message: 'Enter the height.' })
      .positive('The height must be more than zero.')
      .max(60, 'A wall higher than 60 m is not a wall.'),
  })
  .refine((w) => Math.hypot(w.bM[0] - w.aM[0], w.bM[1] - w.aM[1]) >= 0.01, {
    message: 'A wall needs two different ends (at least 10 mm apart).',
    path: ['bM'],
  });

/** Who must be seen in a zone: a standing adult, a child, or a custom height. */
export const targetKinds = ['adult', 'child', 'custom'] as const;
export const zoneTarget = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('adult') }),
  z.object({ kind: z.literal('child') }),
  z.object({
    kind: z.literal('custom'),
    heightM: z.number().positive('The target height must be more than zero.').max(10, 'The target height must be at most 10 m.'),
  }),
]);
export type ZoneTarget = z.infer<typeof zoneTarget>;

export const zone = z.object({
  id: sceneId,
  name: label('zone'),
  polygonM: z
    .array(pair)
    .min(3, 'A zone needs at least three corners.')
    .max(SCENE_LIMITS.cornersPerZone, LIMIT_MESSAGES.cornersPerZone)
    .refine((ring) => isSimpleRing(ring), 'The zone outline crosses or touches itself; redraw it as one simple outline.'),
  target: zoneTarget.default({ kind: 'adult' }),
  /** Detect or recognise; absent in zones saved before criteria existed, which mean recognise. */
  criterion: criterionKind.optional(),
});

export const viewer = z.object({
  id: sceneId,
  name: label('viewer'),
  positionM: pair,
  eyeHeightM: z
    .number({ message: 'Enter the eye height.' })
    .min(0.3, 'An eye height under 0.3 m is not a seated or standing person.')
    .max(6, 'An eye height over 6 m is not a person on the floor.'),
});

export const scene = z
  .object({
    walls: z.array(wall).max(SCENE_LIMITS.walls, LIMIT_MESSAGES.walls).default([]),
    zones: z.array(zone).max(SCENE_LIMITS.zones, LIMIT_MESSAGES.zones).default([]),
    viewers: z.array(viewer).max(SCENE_LIMITS.viewers, LIMIT_MESSAGES.viewers).default([]),
    /** The project's detect and recognise angles; absent means the defaults (shared/project-optics/criteria.ts). */
    criteria: criteriaSettings.optional(),
    /** A vehicle job's vehicle (its body, eye, own ground fields and test cylinders); only in projects of kind 'vehicle'. */
    vehicle: vehicle.optional(),
    /** The rules a vehicle job is scored by; absent means the vehicle kind's default (`defaultRuleSet`). */
    ruleSet: vehicleRuleSet.optional(),
    /** An uploaded plan drawn under the scene, with its calibration (shared/schemas/files.ts). */
    underlay: underlay.optional(),
  })
  .superRefine((s, ctx) => {
    if (s.vehicle && (s.walls.length || s.zones.length || s.viewers.length)) {
      ctx.addIssue({
        code: 'custom',
        path: ['vehicle'],
        message: 'A vehicle job has no walls, zones or viewers: describe the body with boxes and add ground fields to the vehicle instead.',
      });
    }
    const corners = s.zones.reduce((sum, z) => sum + z.polygonM.length, 0);
    if (corners > SCENE_LIMITS.zoneCorners) ctx.addIssue({ code: 'custom', path: ['zones'], message: LIMIT_MESSAGES.zoneCorners });
    const seen = new Set<string>();
    for (const [listName, list] of [
      ['walls', s.walls],
      ['zones', s.zones],
      ['viewers', s.viewers],
    ] as const) {
      list.forEach((item, i) => {
        if (seen.has(item.id)) ctx.addIssue({ code: 'custom', path: [listName, i, 'id'], message: 'Two items in the plan share an id.' });
        seen.add(item.id);
      });
    }
  });
export type Scene = z.infer<typeof scene>;
export type SceneWall = z.infer<typeof wall>;
export type SceneZone = z.infer<typeof zone>;
export type SceneViewer = z.infer<typeof viewer>;

export const projectKinds = ['site', 'vehicle'] as const;
export type ProjectKind = (typeof projectKinds)[number];

/**
 * A scene must suit its project's kind: a vehicle job carries its vehicle, a site job none. The
 * create schema and the PATCH route (which knows the stored kind) both ask this.
 */
export function sceneKindProblem(
  kind: ProjectKind,
  s: { vehicle?: unknown; ruleSet?: unknown },
): { path: ['scene', 'vehicle' | 'ruleSet']; message: string } | null {
  if (kind === 'vehicle' && !s.vehicle)
    return {
      path: ['scene', 'vehicle'],
      message: 'A vehicle job needs its vehicle: choose a kind of vehicle and adjust its measurements.',
    };
  if (kind === 'site' && s.vehicle)
    return { path: ['scene', 'vehicle'], message: 'A site job has no vehicle; start a vehicle job for a vehicle.' };
  if (kind === 'site' && s.ruleSet)
    return { path: ['scene', 'ruleSet'], message: 'Only a vehicle job is scored by vehicle rules; a site job has no rule set.' };
  return null;
}
const projectFields = {
  name: zodText(projectRules.name),
  customer: zodText(projectRules.customer).default(''),
  site: zodText(projectRules.site).default(''),
  kind: z.enum(projectKinds, { message: 'Choose a site or a vehicle.' }).default('site'),
  units: unitSystem.nullable().default(null),
  notes: zodText(projectRules.notes).default(''),
  scene: scene.default({ walls: [], zones: [], viewers: [] }),
};

export const createProjectBody = z
  .object(projectFields)
  .strict()
  .superRefine((b, ctx) => {
    const problem = sceneKindProblem(b.kind, b.scene);
    if (problem) ctx.addIssue({ code: 'custom', ...problem });
  });
export type CreateProjectBody = z.input<typeof createProjectBody>;

export const patchProjectBody = z
  .object({
    version: z.number({ message: 'The change must say which version it edits.' }).int(),
    name: projectFields.name.optional(),
    customer: zodText(projectRules.customer).optional(),
    site: zodText(projectRules.site).optional(),
    units: unitSystem.nullable().optional(),
    notes: zodText(projectRules.notes).optional(),
    scene: scene.optional(),
    /** Present only to refuse it with a sentence: a site stays a site and a vehicle a vehicle. */
    kind: z.never({ message: 'A project’s kind cannot change; start a new project for a site or a vehicle.' }).optional(),
  })
  .strict();
export type PatchProjectBody = z.input<typeof patchProjectBody>;

const angle = (what: string, min: number, max: number) =>
  z
    .number({ message: `Enter the ${what}.` })
    .finite(`Enter the ${what} as a number.`)
    .min(min, `The ${what} is out of range.`)
    .max(max, `The ${what} is out of range.`);

/** Placement fields without defaults: a PATCH must not fill in what it did not say. */
const placementFields = {
  label: label('mirror'),
  catalogueItemId: z.number().int().positive().nullable(),
  customMirror: checkedMirrorSpec.nullable(),
  positionM: pair,
  heightM: zodNumber(mountingHeightRule('metric')),
  azimuthRad: angle('aim direction', PLACEMENT_LIMITS.azimuthRad.min, PLACEMENT_LIMITS.azimuthRad.max),
  tiltDownRad: angle('tilt', PLACEMENT_LIMITS.tiltDownRad.min, PLACEMENT_LIMITS.tiltDownRad.max),
  viewerId: sceneId.nullable(),
  notes: zodText(placementRules.notes),
  /** Vehicle jobs only: the class it is fitted as (for the mounting checks), or none. */
  mirrorClass: mirrorClass.nullable(),
  /**
   * Vehicle jobs only: the ids of the fields this mirror counts toward (library fields such as
   * `un-v-left`, or the installer's own); null counts it toward every field.
   */
  servesFieldIds: z
    .array(sceneId, { message: 'List the fields this mirror serves.' })
    .max(60, 'A mirror can serve at most 60 fields.')
    .nullable(),
};

const oneMirror = (b: { catalogueItemId?: number | null; customMirror?: unknown }) =>
  (b.catalogueItemId == null) !== (b.customMirror == null);
const oneMirrorMessage = { message: 'Choose a catalogue mirror or describe a custom one (one of the two).', path: ['catalogueItemId'] };

export const createPlacementBody = z
  .object({
    ...placementFields,
    catalogueItemId: placementFields.catalogueItemId.default(null),
    customMirror: placementFields.customMirror.default(null),
    viewerId: placementFields.viewerId.default(null),
    notes: placementFields.notes.default(''),
    mirrorClass: placementFields.mirrorClass.default(null),
    servesFieldIds: placementFields.servesFieldIds.default(null),
  })
  .strict()
  .refine(oneMirror, oneMirrorMessage);
export type CreatePlacementBody = z.input<typeof createPlacementBody>;

export const patchPlacementBody = z
  .object({ ...placementFields, version: z.number().int() })
  .partial()
  .required({ version: true })
  .strict()
  .refine((b) => (b.catalogueItemId === undefined && b.customMirror === undefined) || oneMirror(b), oneMirrorMessage);
export type PatchPlacementBody = z.input<typeof patchPlacementBody>;

export const placementDto = z.object({
  id: z.number(),
  projectId: z.number(),
  label: z.string(),
  catalogueItemId: z.number().nullable(),
  customMirror: checkedMirrorSpec.nullable(),
  positionM: z.tuple([z.number(), z.number()]),
  heightM: z.number(),
  azimuthRad: z.number(),
  tiltDownRad: z.number(),
  viewerId: z.string().nullable(),
  notes: z.string(),
  /** Vehicle mirrors' class and served fields; the server always sends them (null on a site), absent reads as null. */
  mirrorClass: mirrorClass.nullable().optional(),
  servesFieldIds: z.array(z.string()).nullable().optional(),
  version: z.number(),
  updatedAt: z.string(),
});
export type PlacementDto = z.infer<typeof placementDto>;

/** A placement write's answer: the placement and the project's version after it (every mirror change counts on the job). */
export const placementWriteResponse = z.object({ placement: placementDto, projectVersion: z.number() });
export type PlacementWriteResponse = z.infer<typeof placementWriteResponse>;
export const placementRemoveResponse = z.object({ projectVersion: z.number() });
export type PlacementRemoveResponse = z.infer<typeof placementRemoveResponse>;

export const projectSummaryDto = z
  .object({
    id: z.number(),
    name: z.string(),
    customer: z.string(),
    site: z.string(),
    kind: z.enum(projectKinds),
    ownerId: z.number(),
    ownerName: z.string(),
    placementCount: z.number(),
    version: z.number(),
    createdAt: z.string(),
    updatedAt: z.string(),
  })
  .extend(reviewFieldsDto.shape);
export type ProjectSummaryDto = z.infer<typeof projectSummaryDto>;

export const projectDto = projectSummaryDto.extend({
  units: unitSystem.nullable(),
  notes: z.string(),
  scene,
  placements: z.array(placementDto),
  canEdit: z.boolean(),
});
export type ProjectDto = z.infer<typeof projectDto>;
