import { defaultAims, vertexOnFace } from '../../../shared/optics';
import { evaluateProject, mirrorOfSpec } from '../../../shared/project-optics';
import { quickPlacementBody, quickRankInput, quickScene, rankQuick, type QuickQuestion } from '../../../shared/quick';
import { demoCatalogueDtos } from '../../../server/seeders/demo-catalogue';

// A long aisle seen for a child from a low mirror: no demo mirror sees all of it, so the ranking has work to do.
const q: QuickQuestion = {
  spot: 'aisle',
  who: 'child',
  passageWidthM: 3,
  openingWidthM: 2.5,
  depthM: 30,
  viewerBackM: 3,
  eyeHeightM: 1.6,
  mirrorAlongM: 1.2,
  mirrorHeightM: 2.2,
};
const all = demoCatalogueDtos();
// Three of the demo items: small and large round, and a panel (domes hang at the engine's own tilt).
const catalogue = all.filter((c) => ['DEMO-R300', 'DEMO-R800', 'DEMO-P400x600'].includes(c.code));

/**
 * Every option the search may return, scored the way a saved job is scored (the project's own
 * evaluation of the zone), not through the search: item × the engine's default aims at the mount.
 */
function bruteForce() {
  const scene = quickScene(q);
  const input = quickRankInput(q, catalogue, 1);
  const { vertexM: onFace, face } = input.mountPoints[0];
  const out: { code: string; fraction: number; cost: number }[] = [];
  for (const item of catalogue) {
    for (const aim of defaultAims(onFace, input.zone)) {
      // Each mirror hangs with its back on the far wall; an aim facing into the wall is no option.
      const hung = vertexOnFace({ mirror: mirrorOfSpec(item.mirror), onFaceM: onFace, ...aim, face: face! });
      if (!hung) continue;
      const [x, y, heightM] = hung.vertexM;
      const body = quickPlacementBody({ catalogueItemId: item.id, positionM: [x, y], heightM, ...aim });
      const p = { ...body, id: 1, customMirror: null, viewerId: body.viewerId ?? null, catalogueItemId: item.id };
      const ev = evaluateProject({ scene, placements: [p], catalogue });
      if (ev.placements[0].problem) continue;
      out.push({ code: item.code, fraction: ev.zones[0].fraction, cost: item.unitPriceMinor });
    }
  }
  return out.sort((a, b) => b.fraction - a.fraction || a.cost - b.cost);
}

describe('quick ranking against a brute-force search', () => {
  const ranked = rankQuick(q, catalogue, 3);
  const brute = bruteForce();

  it('finds an option seeing as much of the area as the best of every item and aim', () => {
    expect(brute[0].fraction).toBeLessThan(0.999);
    expect(brute[0].fraction).toBeGreaterThan(0.05);
    // The search ranks in whole per cent; the best it returns is within that step of the best there is.
    expect(ranked[0].fraction).toBeGreaterThanOrEqual(brute[0].fraction - 0.01);
    expect(ranked[0].fraction).toBeLessThanOrEqual(brute[0].fraction + 1e-9);
  });

  it('reports each option’s share as the saved job would compute it', () => {
    for (const o of ranked) {
      const body = quickPlacementBody({
        catalogueItemId: o.item.id,
        positionM: o.positionM,
        heightM: o.heightM,
        azimuthRad: o.azimuthRad,
        tiltDownRad: o.tiltDownRad,
      });
      const p = { ...body, id: 1, customMirror: null, viewerId: body.viewerId ?? null, catalogueItemId: o.item.id };
      const ev = evaluateProject({ scene: quickScene(q), placements: [p], catalogue });
      expect(ev.zones[0].fraction).toBeCloseTo(o.fraction, 3);
    }
  });

  it('shows each mirror once, at its best aim', () => {
    const codes = ranked.map((o) => o.item.code);
    expect(new Set(codes).size).toBe(codes.length);
    for (const o of ranked) {
      const best = brute.find((b) => b.code === o.item.code)!;
      expect(o.fraction).toBeGreaterThanOrEqual(best.fraction - 0.01);
    }
  });

  it('lists options best first by share of the area seen', () => {
    for (let k = 1; k < ranked.length; k++) {
      expect(Math.floor(ranked[k].fraction * 100 + 1e-9)).toBeLessThanOrEqual(Math.floor(ranked[k - 1].fraction * 100 + 1e-9));
    }
  });
});
