/**
 * The content hash covers the engineering content only: what a reviewer approves. Properties over
 * arbitrary inputs (any text, any finite numbers, any units): presentation never moves the hash,
 * and every engineering field does.
 */
import * as fc from 'fast-check';
import type { CatalogueItemDto, MirrorSpec } from '../../shared/schemas';
import type { SheetInput, SheetPlacementInput } from '../../server/pdf/sheet-model';
import { engineeringHash } from '../../server/modules/review/content-hash';

const finite = fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 });
const units = fc.constantFrom('metric' as const, 'imperial' as const);
const spec: fc.Arbitrary<MirrorSpec> = fc.oneof(
  fc.record({ shape: fc.constant('round' as const), diameterM: finite, radiusM: finite }),
  fc.record({ shape: fc.constant('rect' as const), widthM: finite, heightM: finite, radiusM: finite }),
  fc.record({
    shape: fc.constant('dome' as const),
    portion: fc.constantFrom('full' as const, 'half' as const, 'quarter' as const),
    diameterM: finite,
  }),
);
const catalogueItem = (id: number): fc.Arbitrary<CatalogueItemDto> =>
  fc.record({
    id: fc.constant(id),
    code: fc.string({ minLength: 1 }),
    name: fc.string(),
    mirror: spec,
    material: fc.string(),
    reflectance: fc.option(finite),
    massKg: fc.option(finite),
    unitPriceMinor: fc.nat(),
    currency: fc.constantFrom('EUR', 'USD'),
    notes: fc.string(),
    active: fc.boolean(),
    demo: fc.boolean(),
    version: fc.nat(),
    updatedAt: fc.constant('2026-12-01T10:00:00.000Z'),
  });
const placement = (id: number, catalogueIds: number[]): fc.Arbitrary<SheetPlacementInput> =>
  fc
    .record({
      label: fc.string(),
      fromCatalogue: catalogueIds.length ? fc.boolean() : fc.constant(false),
      pick: fc.nat(),
      customMirror: spec,
      positionM: fc.tuple(finite, finite),
      heightM: finite,
      azimuthRad: finite,
      tiltDownRad: finite,
      viewerId: fc.option(fc.string()),
      notes: fc.string(),
    })
    .map(({ fromCatalogue, pick, customMirror, ...p }) => ({
      ...p,
      id,
      catalogueItemId: fromCatalogue ? catalogueIds[pick % catalogueIds.length] : null,
      customMirror: fromCatalogue ? null : customMirror,
    }));
const input: fc.Arbitrary<SheetInput> = fc.tuple(fc.nat({ max: 3 }), fc.nat({ max: 4 })).chain(([items, mirrors]) => {
  const ids = Array.from({ length: items }, (_, i) => i + 1);
  return fc.record({
    project: fc.record({
      id: fc.nat(),
      name: fc.string(),
      customer: fc.string(),
      site: fc.string(),
      kind: fc.constantFrom('site', 'vehicle'),
      notes: fc.string(),
      units: fc.option(units),
      scene: fc.record({
        walls: fc.array(
          fc.record({
            id: fc.string(),
            kind: fc.constantFrom('wall', 'racking'),
            aM: fc.tuple(finite, finite),
            bM: fc.tuple(finite, finite),
            heightM: finite,
          }),
          { maxLength: 4 },
        ),
        zones: fc.constant([]),
        viewers: fc.array(fc.record({ id: fc.string(), name: fc.string(), positionM: fc.tuple(finite, finite), eyeHeightM: finite }), {
          maxLength: 3,
        }),
      }),
    }),
    owner: fc.record({ name: fc.string(), email: fc.string(), units }),
    organization: fc.string(),
    placements: fc.tuple(...Array.from({ length: mirrors }, (_, i) => placement(100 + i, ids))),
    catalogue: fc.tuple(...ids.map(catalogueItem)),
  }) as unknown as fc.Arbitrary<SheetInput>;
});

/** The same value with every object's keys in reverse order. */
function reversedKeys(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(reversedKeys);
  if (v && typeof v === 'object')
    return Object.fromEntries(
      Object.entries(v)
        .reverse()
        .map(([k, x]) => [k, reversedKeys(x)]),
    );
  return v;
}

describe('the content hash', () => {
  it('does not change with the units, the owner, the organisation, prices, catalogue names, mirror ids, or the key order of the plan', () => {
    fc.assert(
      fc.property(input, units, fc.option(units), fc.string(), fc.nat(), (job, ownerUnits, projectUnits, text, price) => {
        const presented: SheetInput = {
          ...job,
          project: {
            ...job.project,
            id: job.project.id + 1,
            units: projectUnits,
            // The same plan with its keys written in another order (as another client might send it).
            scene: reversedKeys(job.project.scene) as SheetInput['project']['scene'],
          },
          owner: { name: text, email: `${text}@x.example`, units: ownerUnits },
          organization: text,
          placements: job.placements.map((p) => ({ ...p, id: p.id + 1000 })),
          catalogue: job.catalogue.map((c) => ({ ...c, name: text, unitPriceMinor: price, currency: 'USD', version: c.version + 1 })),
        };
        expect(engineeringHash(presented)).toBe(engineeringHash(job));
      }),
    );
  });

  it("changes with the job's name, notes, walls and with every mirror's mounting and optics", () => {
    fc.assert(
      fc.property(
        input,
        finite.filter((d) => d !== 0),
        (job, delta) => {
          const before = engineeringHash(job);
          const variants: SheetInput[] = [
            { ...job, project: { ...job.project, name: `${job.project.name}!` } },
            { ...job, project: { ...job.project, notes: `${job.project.notes} ` } },
            { ...job, project: { ...job.project, kind: job.project.kind === 'site' ? 'vehicle' : 'site' } },
            {
              ...job,
              project: {
                ...job.project,
                scene: {
                  ...job.project.scene,
                  walls: [...job.project.scene.walls, { id: 'x', kind: 'wall', aM: [0, 0], bM: [1, 0], heightM: 1 }],
                },
              },
            },
          ];
          job.placements.forEach((p, i) => {
            const swap = (q: Partial<SheetPlacementInput>) => ({
              ...job,
              placements: job.placements.map((x, j) => (j === i ? { ...x, ...q } : x)),
            });
            // Adding a nonzero delta to a finite number may round back to it: only count real changes.
            if (p.heightM + delta !== p.heightM) variants.push(swap({ heightM: p.heightM + delta }));
            if (p.tiltDownRad + delta !== p.tiltDownRad) variants.push(swap({ tiltDownRad: p.tiltDownRad + delta }));
            variants.push(swap({ label: `${p.label}'` }));
            if (p.catalogueItemId != null) {
              variants.push({
                ...job,
                catalogue: job.catalogue.map((c) => (c.id === p.catalogueItemId ? { ...c, code: `${c.code}-B` } : c)),
              });
            } else if (p.customMirror && p.customMirror.shape !== 'dome' && p.customMirror.radiusM + delta !== p.customMirror.radiusM) {
              variants.push(swap({ customMirror: { ...p.customMirror, radiusM: p.customMirror.radiusM + delta } }));
            }
          });
          for (const v of variants) expect(engineeringHash(v)).not.toBe(before);
        },
      ),
    );
  });
});
