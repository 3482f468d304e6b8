/**
 * DEMO DATA — a fictional floor-plan image for the demo cold store, so a person trying the product
 * sees a plan under the drawing. It is drawn from the job's own walls (hall walls dark, racking as
 * outlined blocks with their bays) plus invented features: dock doors, a personnel door, a fire
 * exit, a building grid, room names, a north arrow, a scale bar and a title block reading
 * "DEMO PLAN — fictional". The SVG is turned into a PNG by sharp, then stored exactly as an upload
 * is (sniffed, re-encoded, thumbnail, storage, `StoredFile`), and the scene's underlay is calibrated
 * on the longest wall so that every drawn wall lies on the scene's wall.
 */
import sharp from 'sharp';
import type { Scene, SceneWall, Underlay } from '../../shared/schemas';

/** Image pixels per plan metre (a 40 m hall is 1,200 px across). */
export const DEMO_PLAN_PX_PER_M = 30;
/** Blank paper around the walls, pixels; the title block sits below. */
const MARGIN_PX = 70;
const TITLE_PX = 120;
/** The underlay's opacity: faint enough that the plan's own lines, fans and labels read over it. */
export const DEMO_PLAN_OPACITY = 0.4;
export const DEMO_PLAN_TITLE = 'DEMO PLAN — fictional';

const INK = '#1d2733';
const RACK = '#4b6478';
const GRID = '#d3dae2';
const FONT = 'DejaVu Sans, Liberation Sans, sans-serif';

type Pt = readonly [number, number];

export interface DemoPlanDrawing {
  svg: string;
  widthPx: number;
  heightPx: number;
  /** Plan metres to image pixels (x right, y down), as the drawing places every wall. */
  toPx: (p: Pt) => [number, number];
  /** The underlay that puts this image's walls on the scene's walls (its `fileId` is filled in when stored). */
  underlay: Omit<Underlay, 'fileId'>;
}

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
const f1 = (n: number) => (Math.round(n * 100) / 100).toString();

/** Walls that share ends, as groups (a rack block's four faces, the hall's four walls). */
function wallGroups(walls: readonly SceneWall[]): SceneWall[][] {
  const parent = walls.map((_, i) => i);
  const find = (i: number): number => (parent[i] === i ? i : (parent[i] = find(parent[i])));
  const key = (p: Pt) => `${p[0]},${p[1]}`;
  const byEnd = new Map<string, number>();
  walls.forEach((w, i) => {
    for (const end of [w.aM, w.bM]) {
      const k = key(end);
      const j = byEnd.get(k);
      if (j === undefined) byEnd.set(k, i);
      else parent[find(i)] = find(j);
    }
  });
  const groups = new Map<number, SceneWall[]>();
  walls.forEach((w, i) => groups.set(find(i), [...(groups.get(find(i)) ?? []), w]));
  return [...groups.values()];
}

function boxOf(walls: readonly SceneWall[]) {
  const xs = walls.flatMap((w) => [w.aM[0], w.bM[0]]);
  const ys = walls.flatMap((w) => [w.aM[1], w.bM[1]]);
  return { x0: Math.min(...xs), x1: Math.max(...xs), y0: Math.min(...ys), y1: Math.max(...ys) };
}

/** The demo plan as SVG, from the scene's walls. */
export function drawDemoPlan(scene: Pick<Scene, 'walls'>, subtitle: string): DemoPlanDrawing {
  const S = DEMO_PLAN_PX_PER_M;
  const all = boxOf(scene.walls);
  const widthPx = Math.round(2 * MARGIN_PX + (all.x1 - all.x0) * S);
  const heightPx = Math.round(2 * MARGIN_PX + (all.y1 - all.y0) * S + TITLE_PX);
  const toPx = (p: Pt): [number, number] => [MARGIN_PX + (p[0] - all.x0) * S, MARGIN_PX + (all.y1 - p[1]) * S];
  const out: string[] = [];
  const line = (a: Pt, b: Pt, stroke: string, width: number, extra = '') => {
    const [ax, ay] = toPx(a);
    const [bx, by] = toPx(b);
    out.push(`<line x1="${f1(ax)}" y1="${f1(ay)}" x2="${f1(bx)}" y2="${f1(by)}" stroke="${stroke}" stroke-width="${width}" ${extra}/>`);
  };
  const text = (p: Pt, s: string, size: number, attrs = '') => {
    const [x, y] = toPx(p);
    out.push(`<text x="${f1(x)}" y="${f1(y)}" font-family="${FONT}" font-size="${size}" fill="${INK}" ${attrs}>${esc(s)}</text>`);
  };

  out.push(`<rect width="${widthPx}" height="${heightPx}" fill="#ffffff"/>`);
  // The building grid every 5 m, lettered along x and numbered along y (invented).
  for (let x = Math.ceil(all.x0 / 5) * 5, n = 0; x <= all.x1; x += 5, n++) {
    line([x, all.y0 - 1], [x, all.y1 + 1], GRID, 1);
    text([x, all.y1 + 1.3], String.fromCharCode(65 + n), 14, 'text-anchor="middle" fill-opacity="0.7"');
  }
  for (let y = Math.ceil(all.y0 / 5) * 5, n = 1; y <= all.y1; y += 5, n++) {
    line([all.x0 - 1, y], [all.x1 + 1, y], GRID, 1);
    text([all.x0 - 1.4, y - 0.15], String(n), 14, 'text-anchor="middle" fill-opacity="0.7"');
  }

  // Racking blocks: filled, with a bay line every 2.7 m along their length (a common pallet bay).
  const groups = wallGroups(scene.walls);
  let rackNo = 0;
  for (const g of groups) {
    if (!g.every((w) => w.kind === 'racking')) continue;
    const b = boxOf(g);
    const [x0, y0] = toPx([b.x0, b.y1]);
    const [x1, y1] = toPx([b.x1, b.y0]);
    out.push(`<rect x="${f1(x0)}" y="${f1(y0)}" width="${f1(x1 - x0)}" height="${f1(y1 - y0)}" fill="#e9eef3"/>`);
    const alongX = b.x1 - b.x0 >= b.y1 - b.y0;
    for (let t = 2.7; t < (alongX ? b.x1 - b.x0 : b.y1 - b.y0) - 0.5; t += 2.7) {
      if (alongX) line([b.x0 + t, b.y0], [b.x0 + t, b.y1], RACK, 1);
      else line([b.x0, b.y0 + t], [b.x1, b.y0 + t], RACK, 1);
    }
    const mid = (b.y0 + b.y1) / 2;
    line([b.x0, mid], [b.x1, mid], RACK, 1, 'stroke-dasharray="6 4"');
    text(
      [(b.x0 + b.x1) / 2, mid + 0.9],
      `PALLET RACKING ${String.fromCharCode(64 + ++rackNo)}`,
      18,
      'text-anchor="middle" font-weight="bold" fill-opacity="0.8"',
    );
  }
  // Every wall of the job, drawn on its own line: racking faces thinner than building walls.
  for (const w of scene.walls) line(w.aM, w.bM, w.kind === 'racking' ? RACK : INK, w.kind === 'racking' ? 3 : 8, 'stroke-linecap="square"');
  // Small wall blocks (columns) filled solid.
  for (const g of groups) {
    const b = boxOf(g);
    if (g.every((w) => w.kind === 'wall') && (b.x1 - b.x0) * (b.y1 - b.y0) < 2) {
      const [x0, y0] = toPx([b.x0, b.y1]);
      const [x1, y1] = toPx([b.x1, b.y0]);
      out.push(`<rect x="${f1(x0)}" y="${f1(y0)}" width="${f1(x1 - x0)}" height="${f1(y1 - y0)}" fill="${INK}"/>`);
    }
  }

  // Invented doors on the outer walls: three dock doors on the south side, a personnel door on the
  // west side and a fire exit on the north side. Drawn beside the wall, not cut into it.
  const { x0, x1, y0, y1 } = all;
  const dock = (from: number, n: number) => {
    line([from, y0 - 0.35], [from + 3, y0 - 0.35], INK, 3, 'stroke-dasharray="8 5"');
    line([from, y0], [from, y0 - 0.6], INK, 2);
    line([from + 3, y0], [from + 3, y0 - 0.6], INK, 2);
    text([from + 1.5, y0 - 1.3], `DOCK ${n}`, 14, 'text-anchor="middle"');
  };
  if (x1 - x0 > 20) [x1 - 16, x1 - 11, x1 - 6].forEach((x, i) => dock(x, i + 1));
  // A door leaf standing open out of the wall, with the quarter arc its edge sweeps back to the wall.
  const leaf = (hinge: Pt, open: Pt, shut: Pt, sweep: 0 | 1, label: Pt, name: string) => {
    line(hinge, open, INK, 2);
    const [ox, oy] = toPx(open);
    const [sx, sy] = toPx(shut);
    const r = DEMO_PLAN_PX_PER_M * Math.hypot(open[0] - hinge[0], open[1] - hinge[1]);
    out.push(
      `<path d="M ${f1(ox)} ${f1(oy)} A ${f1(r)} ${f1(r)} 0 0 ${sweep} ${f1(sx)} ${f1(sy)}" fill="none" stroke="${INK}" stroke-width="1" stroke-dasharray="3 3"/>`,
    );
    text(label, name, 13);
  };
  leaf([x0, y0 + 17], [x0 - 1, y0 + 17], [x0, y0 + 18], 1, [x0 + 0.3, y0 + 17.6], 'STAFF DOOR');
  leaf([x0 + 10, y1], [x0 + 10, y1 + 1], [x0 + 11, y1], 1, [x0 + 10.3, y1 - 0.6], 'FIRE EXIT');
  text([(x0 + x1) / 2, y1 - 1.2], 'COLD STORE — HALL 2', 22, 'text-anchor="middle" font-weight="bold" fill-opacity="0.55"');
  text([(x0 + x1) / 2, (y0 + y1) / 2 + 0.1], 'MAIN AISLE', 16, 'text-anchor="middle" fill-opacity="0.6"');
  text([x1 - 9, y0 + 1], 'LOADING DOCK APRON', 16, 'text-anchor="middle" fill-opacity="0.6"');

  // North arrow (y north on the plan is up in the image).
  const [nx, ny] = [widthPx - MARGIN_PX / 2, MARGIN_PX / 2 + 8];
  out.push(`<path d="M ${nx} ${ny - 22} L ${nx - 9} ${ny + 8} L ${nx} ${ny + 2} L ${nx + 9} ${ny + 8} Z" fill="${INK}"/>`);
  out.push(`<text x="${nx}" y="${ny + 26}" font-family="${FONT}" font-size="13" text-anchor="middle" fill="${INK}">N</text>`);

  // Title block and a 10 m scale bar along the bottom.
  const top = heightPx - TITLE_PX + 12;
  const left = MARGIN_PX;
  const right = widthPx - MARGIN_PX;
  out.push(
    `<rect x="${left}" y="${top}" width="${right - left}" height="${TITLE_PX - 28}" fill="#ffffff" stroke="${INK}" stroke-width="2"/>`,
  );
  const tx = right - 560;
  out.push(`<line x1="${tx}" y1="${top}" x2="${tx}" y2="${top + TITLE_PX - 28}" stroke="${INK}" stroke-width="2"/>`);
  out.push(
    `<text x="${tx + 16}" y="${top + 34}" font-family="${FONT}" font-size="26" font-weight="bold" fill="${INK}">${esc(DEMO_PLAN_TITLE)}</text>`,
    `<text x="${tx + 16}" y="${top + 58}" font-family="${FONT}" font-size="14" fill="${INK}">${esc(subtitle)}</text>`,
    `<text x="${tx + 16}" y="${top + 78}" font-family="${FONT}" font-size="13" fill="${INK}">Drawn for the Sightfan demo: not a real building. Grid 5 m.</text>`,
  );
  const bar = 10 * S;
  const by = top + 50;
  for (let i = 0; i < 5; i++) {
    out.push(
      `<rect x="${left + 20 + (i * bar) / 5}" y="${by}" width="${bar / 5}" height="10" fill="${i % 2 ? '#ffffff' : INK}" stroke="${INK}" stroke-width="1"/>`,
    );
  }
  out.push(
    `<text x="${left + 20}" y="${by - 8}" font-family="${FONT}" font-size="13" fill="${INK}">0</text>`,
    `<text x="${left + 20 + bar}" y="${by - 8}" font-family="${FONT}" font-size="13" text-anchor="middle" fill="${INK}">10 m</text>`,
  );

  // Calibrated on the longest wall's two ends: the image's scale is exactly S px per metre, and
  // its top-left pixel sits MARGIN_PX / S beyond the walls' bounds.
  const longest = scene.walls.reduce((a, b) =>
    Math.hypot(b.bM[0] - b.aM[0], b.bM[1] - b.aM[1]) > Math.hypot(a.bM[0] - a.aM[0], a.bM[1] - a.aM[1]) ? b : a,
  );
  const underlay: Omit<Underlay, 'fileId'> = {
    calibration: {
      aPx: toPx(longest.aM),
      bPx: toPx(longest.bM),
      distanceM: Math.hypot(longest.bM[0] - longest.aM[0], longest.bM[1] - longest.aM[1]),
    },
    originM: [all.x0 - MARGIN_PX / S, all.y1 + MARGIN_PX / S],
    rotationRad: 0,
    opacity: DEMO_PLAN_OPACITY,
  };
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${widthPx}" height="${heightPx}" viewBox="0 0 ${widthPx} ${heightPx}">${out.join('')}</svg>`;
  return { svg, widthPx, heightPx, toPx, underlay };
}

/** The drawing as a PNG (sharp draws the SVG). */
export async function demoPlanPng(drawing: DemoPlanDrawing): Promise<Buffer> {
  return sharp(Buffer.from(drawing.svg)).png({ compressionLevel: 6 }).toBuffer();
}
