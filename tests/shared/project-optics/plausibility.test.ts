/**
 * The plausibility sentences: a mirror above the walls it hangs on, and a viewer's eye behind the
 * mirror's mounting surface. Properties over every placement, mirror and scene the API accepts.
 */
import * as fc from 'fast-check';
import { coverage, poseFromAim, type Mirror } from '../../../shared/optics';
import {
  aboveWallsSentence,
  eyeBehindMountSentence,
  HANGS_WITHIN_M,
  mirrorOfSpec,
  plausibilitySentences,
  wallsMirrorHangsOn,
} from '../../../shared/project-optics';
import { checkedMirrorSpec, PLACEMENT_LIMITS, scene as sceneSchema, wallKinds, type MirrorSpec, type Scene } from '../../../shared/schemas';
import { formatLength } from '../../../shared/units';

const RUNS = 400;
const size = (min: number, max: number) => fc.double({ min, max, noNaN: true });
const anyMirror: fc.Arbitrary<Mirror> = fc
  .oneof(
    fc.record({ shape: fc.constant('round' as const), diameterM: size(0.05, 3), radiusM: size(0.05, 50) }),
    fc.record({ shape: fc.constant('rect' as const), widthM: size(0.05, 3), heightM: size(0.05, 3), radiusM: size(0.05, 50) }),
    fc.record({
      shape: fc.constant('dome' as const),
      portion: fc.constantFrom('full' as const, 'half' as const, 'quarter' as const),
      diameterM: size(0.1, 3),
    }),
  )
  .filter((m: MirrorSpec) => checkedMirrorSpec.safeParse(m).success)
  .map(mirrorOfSpec);
const anyPanel = anyMirror.filter((m) => m.shape !== 'dome');
const anyPlacement = fc.record({
  positionM: fc.tuple(size(-2000, 2000), size(-2000, 2000)),
  heightM: size(PLACEMENT_LIMITS.heightM.min, PLACEMENT_LIMITS.heightM.max),
  azimuthRad: size(PLACEMENT_LIMITS.azimuthRad.min, PLACEMENT_LIMITS.azimuthRad.max),
  tiltDownRad: size(PLACEMENT_LIMITS.tiltDownRad.min, PLACEMENT_LIMITS.tiltDownRad.max),
});
/** Walls and viewers anywhere the API accepts, or within a few metres of the origin's neighbour `near`. */
const anySceneNear = (near: [number, number]): fc.Arbitrary<Scene> => {
  const pointNear = fc.oneof(
    fc.tuple(size(-2000, 2000), size(-2000, 2000)),
    fc.tuple(size(-3, 3), size(-3, 3)).map(([dx, dy]): [number, number] => [near[0] + dx, near[1] + dy]),
  );
  const wall = fc.record({ kind: fc.constantFrom(...wallKinds), aM: pointNear, bM: pointNear, heightM: size(1e-3, 60) });
  const viewer = fc.record({ name: fc.string({ minLength: 1, maxLength: 20 }), positionM: pointNear, eyeHeightM: size(0.3, 6) });
  return fc
    .record({ walls: fc.array(wall, { maxLength: 5 }), viewers: fc.array(viewer, { maxLength: 3 }) })
    .map(({ walls, viewers }) => ({
      walls: walls.map((w, i) => ({ ...w, id: `w${i}` })),
      zones: [],
      viewers: viewers.map((v, i) => ({ ...v, id: `v${i}` })),
    }))
    .filter((s) => sceneSchema.safeParse(s).success) as fc.Arbitrary<Scene>;
};
const anyUnits = fc.constantFrom('metric' as const, 'imperial' as const);
const sentenceLooksRight = (s: string) => /[.]$/.test(s) && !/NaN|Infinity|undefined|null/.test(s);

describe('plausibility sentences over the whole accepted input', () => {
  it('never throw, and are either absent or a finished sentence without NaN', () => {
    fc.assert(
      fc.property(
        anyPlacement.chain((p) => fc.tuple(fc.constant(p), anySceneNear(p.positionM))),
        anyMirror,
        anyUnits,
        fc.nat(5),
        ([p, scene], mirror, units, pick) => {
          const viewerId = scene.viewers.length ? scene.viewers[pick % scene.viewers.length].id : null;
          const out = plausibilitySentences({ label: 'M1', mirror, placement: { ...p, viewerId }, scene, units });
          for (const s of out) expect(sentenceLooksRight(s)).toBe(true);
        },
      ),
      { numRuns: RUNS },
    );
  });
});

describe('a mirror mounted above the walls it hangs on', () => {
  /** A wall square to the aim, `behindM` behind the mirror's centre, `heightM` high. */
  const wallBehind = (p: { positionM: [number, number]; azimuthRad: number }, behindM: number, heightM: number): Scene['walls'][number] => {
    const [x, y] = p.positionM;
    const back: [number, number] = [x - behindM * Math.cos(p.azimuthRad), y - behindM * Math.sin(p.azimuthRad)];
    const across: [number, number] = [-Math.sin(p.azimuthRad), Math.cos(p.azimuthRad)];
    return {
      id: 'w',
      kind: 'wall',
      aM: [back[0] - 3 * across[0], back[1] - 3 * across[1]],
      bM: [back[0] + 3 * across[0], back[1] + 3 * across[1]],
      heightM,
    };
  };
  const panelScene = (walls: Scene['walls']): Scene => ({ walls, zones: [], viewers: [] });

  it('is said when the centre is above the top of a wall right behind it, naming that wall’s height', () => {
    fc.assert(
      fc.property(anyPlacement, anyUnits, size(0, HANGS_WITHIN_M * 0.99), size(0.01, 1), (p, units, behind, share) => {
        const wallHeight = p.heightM * share * 0.999;
        const scene = panelScene([wallBehind(p, behind, wallHeight)]);
        const s = aboveWallsSentence({ label: 'M1', placement: p, scene, units });
        expect(s).toContain('above the top of wall W1');
        expect(s).toContain(`which is ${formatLength(wallHeight, units)} high`);
      }),
      { numRuns: RUNS },
    );
  });

  it('is not said once the wall reaches the mirror’s centre, nor when the wall is farther than a bracket reaches', () => {
    fc.assert(
      fc.property(anyPlacement, anyUnits, size(0, HANGS_WITHIN_M * 0.99), size(1, 3), size(1.02, 50), (p, units, behind, taller, far) => {
        const tall = panelScene([wallBehind(p, behind, Math.min(60, p.heightM * taller))]);
        expect(aboveWallsSentence({ placement: p, scene: tall, units })).toBeNull();
        const low = panelScene([wallBehind(p, HANGS_WITHIN_M * far, p.heightM / 2)]);
        expect(aboveWallsSentence({ placement: p, scene: low, units })).toBeNull();
      }),
      { numRuns: RUNS },
    );
  });

  it('ignores a low wall the mirror looks toward (in front of it, on the viewer’s side)', () => {
    fc.assert(
      fc.property(anyPlacement, anyUnits, size(0.01, HANGS_WITHIN_M * 0.99), (p, units, ahead) => {
        const scene = panelScene([wallBehind(p, -ahead, p.heightM / 2)]);
        expect(wallsMirrorHangsOn(p, scene)).toEqual([]);
        expect(aboveWallsSentence({ placement: p, scene, units })).toBeNull();
      }),
      { numRuns: RUNS },
    );
  });

  it('says the heights in the reader’s units (a 2.4 m wall and a 3 m mount, to the nearest inch: 7 ft 10 in and 9 ft 10 in)', () => {
    const p = { positionM: [0, 0] as [number, number], heightM: 3, azimuthRad: 0 };
    const scene = panelScene([wallBehind(p, 0.1, 2.4)]);
    expect(aboveWallsSentence({ label: 'M1', placement: p, scene, units: 'metric' })).toMatch(
      /mounted at 3\.00 m, .* which is 2\.40 m high/,
    );
    // 3 m = 118.1 in = 9 ft 10 in; 2.4 m = 94.49 in = 7 ft 10 in (1 in = 25.4 mm exactly).
    expect(aboveWallsSentence({ label: 'M1', placement: p, scene, units: 'imperial' })).toMatch(
      /mounted at 9 ft 10 in, .* which is 7 ft 10 in high/,
    );
  });
});

describe('a viewer’s eye behind the mirror’s mounting surface', () => {
  const eyeOf = (v: [number, number, number]) => ({ name: 'Driver', positionM: [v[0], v[1]] as [number, number], eyeHeightM: v[2] });

  it('a panel: an eye in front of its face plane gets no sentence, the same eye mirrored behind that plane gets one', () => {
    fc.assert(
      fc.property(anyPanel, anyPlacement, size(0.05, 40), size(-20, 20), size(-20, 20), anyUnits, (mirror, p, ahead, across, up, units) => {
        const pose = poseFromAim({
          vertexM: [p.positionM[0], p.positionM[1], p.heightM],
          azimuthRad: p.azimuthRad,
          tiltDownRad: p.tiltDownRad,
        });
        const w = pose.axis;
        // u: horizontal across the face; v = w × u.
        const h = Math.hypot(w[0], w[1]);
        const u: [number, number, number] = h > 1e-9 ? [-w[1] / h, w[0] / h, 0] : [1, 0, 0];
        const v: [number, number, number] = [w[1] * u[2] - w[2] * u[1], w[2] * u[0] - w[0] * u[2], w[0] * u[1] - w[1] * u[0]];
        const at = (s: number): [number, number, number] =>
          [0, 1, 2].map((i) => pose.vertexM[i] + s * w[i] + across * u[i] + up * v[i]) as [number, number, number];
        expect(eyeBehindMountSentence({ label: 'M1', mirror, placement: p, viewer: eyeOf(at(ahead)), units })).toBeNull();
        const s = eyeBehindMountSentence({ label: 'M1', mirror, placement: p, viewer: eyeOf(at(-ahead)), units });
        expect(s).toContain('is behind the plane of its face');
        expect(s).toContain('cannot see “M1”');
      }),
      { numRuns: RUNS },
    );
  });

  it('a dome: wherever the sentence is absent and the eye is outside its sphere, the engine traces the coverage without refusing the eye', () => {
    const anyDome = anyMirror.filter((m) => m.shape === 'dome');
    fc.assert(
      fc.property(anyDome, anyPlacement, size(-15, 15), size(-15, 15), size(0.3, 6), (mirror, p, dx, dy, eyeH) => {
        const eye: [number, number, number] = [p.positionM[0] + dx, p.positionM[1] + dy, eyeH];
        const said = eyeBehindMountSentence({ mirror, placement: p, viewer: eyeOf(eye), units: 'metric' });
        const pose = poseFromAim({
          vertexM: [p.positionM[0], p.positionM[1], p.heightM],
          azimuthRad: p.azimuthRad,
          tiltDownRad: p.tiltDownRad,
        });
        let refused: string | null = null;
        try {
          coverage({ mirror, pose, eyeM: eye, maxRangeM: 2, walls: [] });
        } catch (e) {
          refused = (e as Error).message;
        }
        // The engine refuses an eye on the closed side with its own words; the sentence must agree.
        if (refused?.includes('behind the dome')) expect(said).not.toBeNull();
        if (refused === null) expect(said).toBeNull();
      }),
      { numRuns: 150 },
    );
  });

  it('is said beside the numbers: a project whose viewer stands behind a wall-mounted mirror gets it', () => {
    const scene: Scene = {
      walls: [{ id: 'w1', kind: 'wall', aM: [0, -5], bM: [0, 5], heightM: 4 }],
      zones: [],
      viewers: [{ id: 'v1', name: 'Walker', positionM: [-3, 0], eyeHeightM: 1.6 }],
    };
    const mirror: Mirror = { shape: 'round', diameterM: 0.6, radiusM: 0.8 };
    const placement = { positionM: [0.1, 0] as [number, number], heightM: 2.5, azimuthRad: 0, tiltDownRad: 0.1, viewerId: 'v1' };
    expect(plausibilitySentences({ label: 'M1', mirror, placement, scene, units: 'metric' })).toEqual([
      expect.stringContaining('The eye of viewer “Walker” is behind the plane of its face'),
    ]);
  });
});
