/**
 * A vehicle job through project-optics, over the whole accepted input space: any vehicle the
 * schema accepts, any rule set, and mirrors the API accepts anywhere (positions to ±2 km, heights
 * 0.2–30 m, any aim and tilt, any valid mirror) serving every field, some fields or fields that
 * no longer exist. Every placement gets numbers or a sentence, every field a share in [0, 1]
 * whose verdict agrees with its pass mark, or the job a sentence: never NaN, never a throw.
 */
import * as fc from 'fast-check';
import { evaluateVehicleJob, formatFieldShare, ProjectEvaluator, vehicleJobFields } from '../../../shared/project-optics';
import {
  checkedMirrorSpec,
  PLACEMENT_LIMITS,
  scene as sceneSchema,
  vehicle,
  vehicleRuleSets,
  type CatalogueItemDto,
  type MirrorSpec,
} from '../../../shared/schemas';
import { vehicleGeometry } from '../../../shared/vehicle';
import { aimBetween, anyVehicle } from '../vehicle/fixtures';

const size = (min: number, max: number) => fc.double({ min, max, noNaN: true });
const anyMirror: fc.Arbitrary<MirrorSpec> = fc
  .oneof(
    fc.record({ shape: fc.constant('round' as const), diameterM: size(0.05, 3), radiusM: size(0.05, 50) }),
    fc.record({ shape: fc.constant('rect' as const), widthM: size(0.05, 3), heightM: size(0.05, 3), radiusM: size(0.05, 50) }),
    fc.record({
      shape: fc.constant('dome' as const),
      portion: fc.constantFrom('full' as const, 'half' as const, 'quarter' as const),
      diameterM: size(0.1, 3),
    }),
  )
  .filter((m) => checkedMirrorSpec.safeParse(m).success);

/** Near the vehicle most of the time (where mirrors go), anywhere the API accepts otherwise. */
const coordinate = fc.oneof({ weight: 3, arbitrary: size(-14, 4) }, { weight: 1, arbitrary: size(-2000, 2000) });
const lateral = fc.oneof({ weight: 3, arbitrary: size(-4, 4) }, { weight: 1, arbitrary: size(-2000, 2000) });

const anyPlacement = fc.record({
  mirror: anyMirror,
  x: coordinate,
  y: lateral,
  heightM: size(PLACEMENT_LIMITS.heightM.min, PLACEMENT_LIMITS.heightM.max),
  azimuthRad: size(PLACEMENT_LIMITS.azimuthRad.min, PLACEMENT_LIMITS.azimuthRad.max),
  tiltDownRad: size(PLACEMENT_LIMITS.tiltDownRad.min, PLACEMENT_LIMITS.tiltDownRad.max),
  /** null: every field; else a pick among the job's fields plus one that does not exist. */
  serves: fc.option(fc.array(fc.nat(20), { maxLength: 4 }), { nil: null }),
});

/** A mirror an installer would fit: beside the cab on either side, a little above the eyes, aimed from the eyes at a field's middle. */
const fitted = fc.record({
  side: fc.constantFrom(1, -1),
  aheadM: size(-0.8, 0.8),
  aboveM: size(-0.3, 0.8),
  field: fc.nat(20),
  mirror: anyMirror,
  serves: fc.option(fc.array(fc.nat(20), { maxLength: 4 }), { nil: null }),
});

const isSentence = (s: unknown) => typeof s === 'string' && /^[A-Z“"].*[.!?]$/.test(s);

describe('a vehicle job over the accepted input space', () => {
  it('gives every placement numbers or a sentence, and every field a share in [0, 1] whose verdict agrees with its pass mark', () => {
    let runsWithSomethingSeen = 0;
    fc.assert(
      fc.property(
        anyVehicle,
        fc.constantFrom(...vehicleRuleSets),
        fitted,
        fc.array(anyPlacement, { minLength: 0, maxLength: 3 }),
        (v, ruleSet, fit, anywhere) => {
          const scene = sceneSchema.parse({ vehicle: vehicle.parse(v), ruleSet });
          const fields = vehicleJobFields(scene);
          const ids = fields.map((f) => f.id);
          const g = vehicleGeometry(scene.vehicle!);
          const target = fields.length ? fields[fit.field % fields.length].polygonM[0] : [[g.eyeMidM[0] - 5, 0] as [number, number]];
          const mid = target.reduce((a, p) => [a[0] + p[0] / target.length, a[1] + p[1] / target.length], [0, 0]);
          const at: [number, number, number] = [
            g.eyeMidM[0] + fit.aheadM,
            fit.side * (scene.vehicle!.widthM / 2 + 0.15),
            Math.max(PLACEMENT_LIMITS.heightM.min, g.eyeMidM[2] + fit.aboveM),
          ];
          const pose = aimBetween(at, g.eyeMidM, [mid[0], mid[1], 0]);
          const aimed = {
            mirror: fit.mirror,
            x: at[0],
            y: at[1],
            heightM: at[2],
            azimuthRad: Math.atan2(pose.axis[1], pose.axis[0]),
            tiltDownRad: Math.asin(Math.max(-1, Math.min(1, -pose.axis[2]))),
            serves: fit.serves,
          };
          const ps = [aimed, ...anywhere];
          const placements = ps.map((p, i) => ({
            id: i + 1,
            label: `M${i + 1}`,
            catalogueItemId: null,
            customMirror: p.mirror,
            positionM: [p.x, p.y] as [number, number],
            heightM: p.heightM,
            azimuthRad: p.azimuthRad,
            tiltDownRad: p.tiltDownRad,
            viewerId: null,
            mirrorClass: null,
            servesFieldIds: p.serves === null ? null : p.serves.map((k) => ids[k] ?? 'gone-field'),
          }));
          const ev = evaluateVehicleJob({ scene, placements, catalogue: [] });
          ev.placements.forEach((pl) => {
            if (pl.numbers) {
              for (const n of [pl.numbers.focalLengthM, pl.numbers.eyeDistanceM, pl.numbers.onAxisFieldOfView.horizontalRad])
                expect(Number.isNaN(n)).toBe(false);
            } else expect(isSentence(pl.problem?.message)).toBe(true);
          });
          if (ev.vehicle.problem !== null) {
            expect(isSentence(ev.vehicle.problem)).toBe(true);
            return;
          }
          if (ev.vehicle.fields.some((f) => f.share > 0)) runsWithSomethingSeen++;
          expect(ev.vehicle.fields.map((f) => f.field.id)).toEqual(ids);
          for (const f of ev.vehicle.fields) {
            expect(f.share).toBeGreaterThanOrEqual(0);
            expect(f.share).toBeLessThanOrEqual(1);
            expect(formatFieldShare(f.share)).toMatch(/^\d{1,3}\.\d %$/);
            const mark = f.field.requiredShare;
            expect(f.verdict).toBe(mark === null ? 'no-verdict' : f.share >= mark ? 'pass' : 'short');
            // Only fitted mirrors that serve this field (or every field) count toward it.
            for (const id of f.mirrorIds) {
              const p = placements[Number(id) - 1];
              expect(ev.placements[Number(id) - 1].numbers).not.toBeNull();
              expect(p.servesFieldIds === null || p.servesFieldIds.includes(f.field.id)).toBe(true);
            }
          }
        },
      ),
      { numRuns: 60 },
    );
    // Not a vacuous property: the aimed mirror shows part of some field in about one run in five
    // (runs under rules with no field for that kind of vehicle, or aimed past the field, see none).
    expect(runsWithSomethingSeen).toBeGreaterThanOrEqual(4);
  });
});

describe('the plan’s evaluator on a vehicle job', () => {
  it('answers a repeated request with the same evaluation and a changed mirror with a new one', () => {
    const scene = sceneSchema.parse({ vehicle: vehicle.parse(fc.sample(anyVehicle, { numRuns: 1, seed: 7 })[0]) });
    const placement = {
      id: 1,
      label: 'M1',
      catalogueItemId: null,
      customMirror: { shape: 'rect' as const, widthM: 0.2, heightM: 0.2, radiusM: 0.4 },
      positionM: [-0.3, 2] as [number, number],
      heightM: 2.2,
      azimuthRad: Math.PI,
      tiltDownRad: 0.3,
      viewerId: null,
    };
    const evaluator = new ProjectEvaluator();
    // The plan hands the same catalogue array each time (a new array means a changed catalogue).
    const catalogue: CatalogueItemDto[] = [];
    const first = evaluator.evaluate({ scene, placements: [placement], catalogue });
    expect(first.vehicle).toBeDefined();
    expect(first.zones).toEqual([]);
    expect(evaluator.evaluate({ scene, placements: [{ ...placement }], catalogue })).toBe(first);
    expect(evaluator.evaluate({ scene, placements: [{ ...placement, tiltDownRad: 0.5 }], catalogue })).not.toBe(first);
  });
});
