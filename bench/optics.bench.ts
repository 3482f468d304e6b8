/**
 * Speed of the optics engine. Budgets (from the engine's issues): one round placement with 256
 * rim rays ≤ 0.5 ms; the same with 200 wall segments ≤ 2 ms and with 1,000 ≤ 10 ms; 30
 * placements plus the zone union ≤ 40 ms; rankOptions over 20 items × 8 mount points × 36 aims
 * ≤ 1 s. Prints medians, and how one placement's time grows with 0, 50, 200 and 1,000 walls,
 * sparse (scattered over a 40 m × 40 m hall) and dense (packed within 8 m of the mirror).
 * `BENCH_ONLY=walls npm run bench` runs the wall growth table alone.
 */
import { Bench } from 'tinybench';
import {
  coverage,
  poseFromAim,
  rankOptions,
  zoneCoverage,
  ARCMIN_RAD,
  type CatalogueItem,
  type Mirror,
  type Polygon,
  type Vec3,
  type Wall,
} from '../shared/optics';
import { rng } from '../tests/shared/optics/helpers';

const mirror: Mirror = { shape: 'round', diameterM: 0.8, radiusM: 1.6 };
const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0.3, tiltDownRad: 0.35 });
const eyeM: Vec3 = [5, 3, 1.6];

/**
 * `n` rack and wall segments (0.5–3 m long, 1–3 m high) scattered over a square of half-side
 * `halfM` about the mirror, none within 1.5 m of the mirror or the eye.
 */
function scatteredWalls(n: number, halfM: number, seed = 111): Wall[] {
  const r = rng(seed);
  const walls: Wall[] = [];
  while (walls.length < n) {
    const x = -halfM + 2 * halfM * r();
    const y = -halfM + 2 * halfM * r();
    const a = r() * Math.PI;
    const len = 0.5 + 2.5 * r();
    const h = 1 + 2 * r();
    if (Math.hypot(x, y) < 1.5 || Math.hypot(x - eyeM[0], y - eyeM[1]) < 1.5) continue;
    walls.push({ aM: [x, y], bM: [x + len * Math.cos(a), y + len * Math.sin(a)], heightM: h });
  }
  return walls;
}

/** 200 rack and wall segments scattered over a 40 m × 40 m demo warehouse. */
const demoWalls = (): Wall[] => scatteredWalls(200, 20);

/** Budget (ms) for one placement with n walls, from the issue: 200 walls 2 ms, 1,000 walls 10 ms. */
const WALL_BUDGET_MS: Record<number, number | undefined> = { 200: 2, 1000: 10 };

/** How one placement's coverage time grows with the number of walls; returns false if a budget is missed. */
async function runWallGrowth(): Promise<boolean> {
  console.log('coverage of one placement (800 mm round, 15 m range) as walls grow — median');
  let sink = 0;
  let allMet = true;
  for (const [label, halfM] of [
    ['sparse, 40 m × 40 m', 20],
    ['dense, 16 m × 16 m', 8],
  ] as const) {
    const row: string[] = [];
    for (const n of [0, 50, 200, 1000]) {
      const walls = scatteredWalls(n, halfM);
      const bench = new Bench({ name: `walls ${n}`, time: 600, warmupTime: 150 });
      bench.add(`${n}`, () => {
        sink += coverage({ mirror, pose, eyeM, maxRangeM: 15, walls }).areaM2;
      });
      await bench.run();
      const res = bench.tasks[0].result;
      const median = res && 'latency' in res ? res.latency.p50 : NaN;
      const budget = WALL_BUDGET_MS[n];
      const met = budget === undefined || median <= budget;
      allMet &&= met;
      row.push(`${n} walls ${fmt(median)}${budget === undefined ? '' : ` (budget ${fmt(budget)}${met ? '' : ', MISSES'})`}`);
    }
    console.log(`  ${label}: ${row.join(' · ')}`);
  }
  if (sink < 0) console.log(sink);
  return allMet;
}

function demoCatalogue(): CatalogueItem[] {
  const items: CatalogueItem[] = [];
  const sizes = [0.3, 0.4, 0.5, 0.6, 0.8, 1.0];
  sizes.forEach((d, i) => items.push({ id: `round-${d}`, mirror: { shape: 'round', diameterM: d, radiusM: 2 * d }, cost: 40 + 100 * d }));
  sizes.forEach((d, i) =>
    items.push({ id: `round-tight-${d}`, mirror: { shape: 'round', diameterM: d, radiusM: 1.2 * d }, cost: 45 + 100 * d + i }),
  );
  [
    [0.4, 0.3],
    [0.6, 0.4],
    [0.8, 0.5],
    [1.0, 0.6],
  ].forEach(([w, h]) =>
    items.push({ id: `rect-${w}x${h}`, mirror: { shape: 'rect', widthM: w, heightM: h, radiusM: 1.5 * w }, cost: 60 + 120 * w }),
  );
  (['full', 'half', 'quarter'] as const).forEach((portion) =>
    items.push({ id: `dome-${portion}`, mirror: { shape: 'dome', portion, diameterM: 0.8 }, cost: 150 }),
  );
  items.push({ id: 'round-1.2', mirror: { shape: 'round', diameterM: 1.2, radiusM: 2.4 }, cost: 300 });
  return items.slice(0, 20);
}

function fmt(ms: number): string {
  return ms < 1 ? `${(ms * 1000).toFixed(1)} µs` : `${ms.toFixed(2)} ms`;
}

export async function runOpticsBench(): Promise<void> {
  const growthMet = await runWallGrowth();
  if (!growthMet) process.exitCode = 1;
  if (process.env.BENCH_ONLY === 'walls') return;
  const walls = demoWalls();
  const r = rng(7);
  const placements = Array.from({ length: 30 }, (_, i) => {
    const x = -15 + 30 * r();
    const y = -15 + 30 * r();
    const az = Math.atan2(-y, -x) + (r() - 0.5);
    return {
      mirror: { shape: 'round', diameterM: 0.5 + 0.5 * r(), radiusM: 1.5 + r() } as Mirror,
      pose: poseFromAim({ vertexM: [x, y, 2.8 + 0.5 * r()], azimuthRad: az, tiltDownRad: 0.2 + 0.3 * r() }),
      eyeM: [x + 4 * Math.cos(az + 0.5), y + 4 * Math.sin(az + 0.5), 1.6] as Vec3,
      id: i,
    };
  });
  const siteZone: Polygon = [
    [
      [-18, -18],
      [18, -18],
      [18, 18],
      [-18, 18],
    ],
  ];
  const rankZone: Polygon = [
    [
      [3, -6],
      [9, -6],
      [9, -2],
      [3, -2],
    ],
  ];
  const catalogue = demoCatalogue();
  const mountPoints = Array.from({ length: 8 }, (_, i) => ({
    id: `m${i}`,
    vertexM: [-2 + i * 1.5, 1 + (i % 3), 2.6 + 0.2 * (i % 2)] as Vec3,
  }));
  const rankEye: Vec3 = [6, 3, 1.6];
  const target = { sizeM: 1.7, minAngleRad: 5 * ARCMIN_RAD };

  const budgets: Record<string, number> = {
    'coverage, 1 round placement, 256 rim rays': 0.5,
    'coverage, 1 placement, 200 wall segments': 2,
    '30 placements + zone union': 40,
    'rankOptions, 20 items × 8 mounts × 36 aims': 1000,
  };
  let sink = 0;
  const fast = new Bench({ name: 'optics', time: 1500, warmupTime: 300 });
  fast
    .add('coverage, 1 round placement, 256 rim rays', () => {
      sink += coverage({ mirror, pose, eyeM, maxRangeM: 15, rimSamples: 256 }).areaM2;
    })
    .add('coverage, 1 placement, 200 wall segments', () => {
      sink += coverage({ mirror, pose, eyeM, maxRangeM: 15, walls }).areaM2;
    })
    .add('30 placements + zone union', () => {
      const regions = placements.map((p) => coverage({ mirror: p.mirror, pose: p.pose, eyeM: p.eyeM, maxRangeM: 12 }).region);
      sink += zoneCoverage({ zone: siteZone, regions }).coveredM2;
    });
  await fast.run();

  const slow = new Bench({ name: 'sizing', time: 0, iterations: 5, warmupIterations: 1 });
  slow.add('rankOptions, 20 items × 8 mounts × 36 aims', () => {
    sink += rankOptions({ catalogue, mountPoints, eyeM: rankEye, zone: rankZone, target }).length;
  });
  await slow.run();

  console.log(`optics engine (sum ${sink.toFixed(0)} keeps the work alive)`);
  let allMet = true;
  for (const task of [...fast.tasks, ...slow.tasks]) {
    const res = task.result;
    if (!res || !('latency' in res)) {
      console.log(`  ${task.name}: no result`);
      allMet = false;
      continue;
    }
    const median = res.latency.p50;
    const budget = budgets[task.name];
    const met = median <= budget;
    allMet &&= met;
    console.log(`  ${task.name}: median ${fmt(median)} (budget ${fmt(budget)}) ${met ? 'meets' : 'MISSES'}`);
  }
  if (!allMet) process.exitCode = 1;
}
