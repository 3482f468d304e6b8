import * as fc from 'fast-check';
import { coverage, OpticsInputError, poseFromAim, type Mirror, type Vec3, type Wall } from '../../../shared/optics';
import { PLACEMENT_LIMITS } from '../../../shared/schemas/limits';
import { regionAgreement } from './region-agreement';

/**
 * The coverage region against the exact point test over the whole input space the API
 * accepts (shared/schemas: catalogue mirror limits, PLACEMENT_LIMITS, viewer eye heights, the
 * drawn range up to 60 m), not only mild placements.
 *
 * Tolerance: floor points within EDGE_MARGIN_M of the region's edge (or of the range circle)
 * are not compared. The region's edge is a polygon through exactly traced points: 256 rays
 * around the mirror's outline, chords refined where they stray more than 3 mm near the range
 * disc (FAN_EDGE_TOLERANCE_M), then simplified within 1 mm; wall shadows have straight pieces
 * within 5 mm. 2 cm covers these with a margin for the sampling between rays.
 */
const EDGE_MARGIN_M = 0.02;

const unit = fc.double({ min: 0, max: 1, noNaN: true, maxExcluded: true });

/** Catalogue limits (shared/schemas/catalogue.ts): sizes 0.05–3 m, R 0.05–50 m, size < 2R. */
const mirrorArb: fc.Arbitrary<Mirror> = fc.oneof(
  fc.record({ d: fc.double({ min: 0.05, max: 3, noNaN: true }), q: unit }).map(({ d, q }) => {
    // q → how deep the cap is, up to 99.9 % of a hemisphere's width (diameter → 2R).
    const radiusM = Math.min(50, Math.max(0.05, d / (2 * (0.02 + 0.979 * q))));
    return { shape: 'round' as const, diameterM: Math.min(d, 1.998 * radiusM), radiusM };
  }),
  fc
    .record({ w: fc.double({ min: 0.05, max: 3, noNaN: true }), h: fc.double({ min: 0.05, max: 3, noNaN: true }), q: unit })
    .map(({ w, h, q }) => {
      const diag = Math.hypot(w, h);
      const radiusM = Math.min(50, Math.max(0.05, diag / (2 * (0.02 + 0.979 * q))));
      const k = Math.min(1, (1.998 * radiusM) / diag);
      return { shape: 'rect' as const, widthM: w * k, heightM: h * k, radiusM };
    }),
  fc
    .record({
      portion: fc.constantFrom('full' as const, 'half' as const, 'quarter' as const),
      diameterM: fc.double({ min: 0.1, max: 3, noNaN: true }),
    })
    .map((m) => ({ shape: 'dome' as const, ...m })),
);

const placementArb = fc.record({
  mirror: mirrorArb,
  heightM: fc.double({ min: PLACEMENT_LIMITS.heightM.min, max: PLACEMENT_LIMITS.heightM.max, noNaN: true }),
  azimuthRad: fc.double({ min: PLACEMENT_LIMITS.azimuthRad.min, max: PLACEMENT_LIMITS.azimuthRad.max, noNaN: true }),
  tiltDownRad: fc.double({ min: PLACEMENT_LIMITS.tiltDownRad.min, max: PLACEMENT_LIMITS.tiltDownRad.max, noNaN: true }),
  // Viewer eye heights 0.3–6 m (shared/schemas/projects.ts); anywhere around the mirror, from
  // almost under it (cubed: many close eyes) to 40 m away.
  eyeHeightM: fc.double({ min: 0.3, max: 6, noNaN: true }),
  eyeDistU: unit,
  eyeAngleRad: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
  maxRangeM: fc.double({ min: 0.1, max: 60, noNaN: true }),
  planeHeightM: fc.oneof(fc.constant(0), fc.double({ min: 0, max: 2, noNaN: true })),
  seed: fc.integer({ min: 1, max: 1_000_000 }),
});

/**
 * 1–5 walls or racks, 0.1–6 m high: crossing the range disc anywhere (through the fan), or
 * standing between the eye and the mirror (hiding part of it from the eye).
 */
const wallsArb = fc.array(
  fc.record({
    between: fc.boolean(),
    hU: unit,
    rU: unit,
    angleRad: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
    dirRad: fc.double({ min: 0, max: Math.PI, noNaN: true }),
    lenU: unit,
    heightM: fc.double({ min: 0.1, max: 6, noNaN: true }),
  }),
  { minLength: 1, maxLength: 5 },
);

type Placement = typeof placementArb extends fc.Arbitrary<infer T> ? T : never;

/** Largest distance from the vertex to any point of the mirror, metres (its size bounds it). */
function extentM(m: Mirror): number {
  return m.shape === 'rect' ? Math.hypot(m.widthM, m.heightM) : m.diameterM;
}

/**
 * Walls from the random draws, kept out of the mirror's own body: a wall through the mirror is
 * geometry that cannot exist (refused elsewhere), not a question for the region.
 */
function wallsFor(
  draws: { between: boolean; hU: number; rU: number; angleRad: number; dirRad: number; lenU: number; heightM: number }[],
  mirror: Mirror,
  maxRangeM: number,
  eyeM: Vec3,
  vertexZ: number,
): Wall[] {
  const keepOut = extentM(mirror) + 0.05;
  const out: Wall[] = [];
  for (const d of draws) {
    const rad = 1.1 * maxRangeM * Math.sqrt(d.rU);
    const cx = d.between ? d.rU * eyeM[0] : rad * Math.cos(d.angleRad);
    const cy = d.between ? d.rU * eyeM[1] : rad * Math.sin(d.angleRad);
    const half = 0.5 * (0.2 + Math.min(10, 1.5 * maxRangeM) * d.lenU);
    const ux = Math.cos(d.dirRad);
    const uy = Math.sin(d.dirRad);
    // A wall between the eye and the mirror gets its top near the eye → mirror sightline, so
    // that it hides part of the mirror.
    const sightZ = eyeM[2] + (1 - d.rU) * (vertexZ - eyeM[2]);
    const heightM = d.between ? Math.max(0.1, sightZ + (d.hU - 0.5) * 2 * extentM(mirror)) : d.heightM;
    const w: Wall = { aM: [cx - half * ux, cy - half * uy], bM: [cx + half * ux, cy + half * uy], heightM };
    // Plan distance from the vertex (origin) to the wall's segment.
    const t = Math.max(-half, Math.min(half, -(cx * ux + cy * uy)));
    if (Math.hypot(cx + t * ux, cy + t * uy) > keepOut) out.push(w);
  }
  return out;
}

function setUp(p: Placement) {
  const pose = poseFromAim({ vertexM: [0, 0, p.heightM], azimuthRad: p.azimuthRad, tiltDownRad: p.tiltDownRad });
  const dist = 0.02 + 40 * p.eyeDistU ** 3;
  const eyeM: Vec3 = [dist * Math.cos(p.eyeAngleRad), dist * Math.sin(p.eyeAngleRad), p.eyeHeightM];
  return { mirror: p.mirror, pose, eyeM, maxRangeM: p.maxRangeM, planeHeightM: p.planeHeightM };
}

/** Coverage, or null when the engine refuses the geometry with a sentence (eye behind, plane cut). */
function tryCoverage(input: Parameters<typeof coverage>[0]) {
  try {
    return coverage(input);
  } catch (e) {
    if (e instanceof OpticsInputError) return null;
    throw e;
  }
}

describe('coverage region over the whole accepted input space', () => {
  it('agrees with the exact point test on random floor points in the range disc (no walls)', () => {
    let compared = 0;
    fc.assert(
      fc.property(placementArb, (p) => {
        const input = setUp(p);
        const res = tryCoverage(input);
        fc.pre(res !== null);
        if (!res) return;
        compared++;
        const a = regionAgreement({ region: res.region, ...input, n: 250, marginM: EDGE_MARGIN_M, seed: p.seed });
        expect(a.disagreements).toEqual([]);
      }),
      { numRuns: 150, seed: 808, maxSkipsPerRun: 1000 },
    );
    expect(compared).toBe(150);
  });

  it('agrees with the exact point test with walls and racks through the fan and beside the eye', () => {
    let compared = 0;
    fc.assert(
      fc.property(placementArb, wallsArb, (p, draws) => {
        const input = setUp(p);
        const walls = wallsFor(draws, p.mirror, p.maxRangeM, input.eyeM, p.heightM);
        const res = tryCoverage({ ...input, walls });
        fc.pre(res !== null);
        if (!res) return;
        compared++;
        const a = regionAgreement({ region: res.region, ...input, walls, n: 200, marginM: EDGE_MARGIN_M, seed: p.seed });
        expect(a.disagreements).toEqual([]);
      }),
      { numRuns: 100, seed: 909, maxSkipsPerRun: 1000 },
    );
    expect(compared).toBe(100);
  });
});
