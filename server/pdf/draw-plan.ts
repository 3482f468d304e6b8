/**
 * The plan drawing: walls, racking, zones with their covered share, the seen floor of each mirror,
 * viewers and mirrors, at a round scale that is stated on the sheet, with a scale bar.
 */
import type { UnitSystem } from '../../shared/schemas';
import { boundsOfPoints } from '../../shared/geometry/bounds';
import { simplifyRing } from '../../shared/geometry/simplify';
import { chooseScaleBar, type ScaleBar } from '../../shared/units';
import type { MultiPolygon } from '../../shared/geometry/polygon';
import { placeLabel, type LabelBox, type Segment } from '../../shared/label-placement';
import { palette } from '../../shared/palette';
import { bandColours, bandWords } from '../../shared/zone-verdict';
import { GLASS, INK, MUTED, PAPER, RULE, STOP } from './layout';
import type { SheetElevation, SheetPlan } from './sheet-model';
import { textWidth, writeText } from './text-runs';
import { underlayToPlan } from '../../shared/geometry/underlay';

/** Image bytes the sheet shows (plan underlay, photos), by file id; JPEG, made for print by the server. */
export type SheetImages = Readonly<Record<string, Uint8Array>>;

/**
 * The plan image under the drawing: each image pixel lands where its calibration puts it on the plan
 * (shared/geometry/underlay.ts), so the image is at the plan's stated scale; faded by its opacity, as
 * on screen. The caller has clipped to the plan frame.
 */
export function drawUnderlay(
  doc: PDFKit.PDFDocument,
  u: NonNullable<SheetPlan['underlay']>,
  image: Uint8Array,
  at: (p: readonly number[]) => [number, number],
): void {
  // The pixel → paper map is affine: take it from where the origin and the two unit steps land.
  const o = at(underlayToPlan(u, [0, 0]));
  const x = at(underlayToPlan(u, [1, 0]));
  const y = at(underlayToPlan(u, [0, 1]));
  doc.save();
  doc.opacity(u.opacity);
  doc.transform(x[0] - o[0], x[1] - o[1], y[0] - o[0], y[1] - o[1], o[0], o[1]);
  doc.image(Buffer.from(image.buffer, image.byteOffset, image.byteLength), 0, 0, { width: u.widthPx, height: u.heightPx });
  doc.restore();
}

/** Points per metre of paper: 72 pt per inch, 0.0254 m per inch. */
export const PT_PER_M = 72 / 0.0254;
/** Round scales an architect would print at. */
export const PLAN_SCALES = [20, 25, 50, 100, 200, 250, 500, 1000, 1250, 2000, 2500, 5000, 10000] as const;

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

export interface PlanFit {
  denominator: number;
  ptPerM: number;
  minX: number;
  maxY: number;
  offsetX: number;
  offsetY: number;
  /** Height of the drawn scene on paper, points. */
  heightPt: number;
}

/**
 * Whether the plan's origin is drawn: always when a mirror is set out from a grid line through it,
 * else when it lies near the scene (within the scene's own span), so a far-off origin does not
 * shrink the plan to a speck.
 */
export function showsOrigin(plan: SheetPlan): boolean {
  if (plan.mirrors.some((m) => m.dimensions?.some((d) => d.wall === null))) return true;
  const b = boundsOfPoints(scenePoints(plan));
  if (!b) return true;
  const span = Math.max(b.maxX - b.minX, b.maxY - b.minY, 1);
  return b.minX - span <= 0 && 0 <= b.maxX + span && b.minY - span <= 0 && 0 <= b.maxY + span;
}

function scenePoints(plan: SheetPlan): [number, number][] {
  return [
    ...plan.walls.flatMap((w) => [w.a, w.b]),
    ...plan.zones.flatMap((z) => z.ring),
    ...plan.viewers.map((v) => v.at),
    ...plan.mirrors.map((m) => m.at),
  ];
}

/** The largest round scale at which the scene (walls, zones, viewers, mirrors, the origin when shown, plus a margin) fits the box. */
export function fitPlan(plan: SheetPlan, box: Box, marginM = 1): PlanFit {
  const points = [...scenePoints(plan), ...(showsOrigin(plan) ? [[0, 0] as [number, number]] : [])];
  const b = boundsOfPoints(points) ?? { minX: 0, minY: 0, maxX: 0, maxY: 0 };
  const minX = b.minX - marginM;
  const maxX = b.maxX + marginM;
  const minY = b.minY - marginM;
  const maxY = b.maxY + marginM;
  const spanX = Math.max(maxX - minX, 1);
  const spanY = Math.max(maxY - minY, 1);
  const denominator =
    PLAN_SCALES.find((n) => (spanX * PT_PER_M) / n <= box.w && (spanY * PT_PER_M) / n <= box.h) ?? PLAN_SCALES[PLAN_SCALES.length - 1];
  const ptPerM = PT_PER_M / denominator;
  return {
    denominator,
    ptPerM,
    minX,
    maxY,
    offsetX: box.x + (box.w - spanX * ptPerM) / 2,
    offsetY: box.y + (box.h - spanY * ptPerM) / 2,
    heightPt: spanY * ptPerM,
  };
}

/** Outline detail finer than this (0.2 mm on paper, in points) cannot be seen in print and is dropped before drawing. */
export const OUTLINE_TOLERANCE_PT = (0.2 / 25.4) * 72;

function ringPath(
  doc: PDFKit.PDFDocument,
  ring: readonly (readonly number[])[],
  at: (p: readonly number[]) => [number, number],
  tolerance = 0,
): void {
  const onPaper = ring.map(at);
  // Douglas–Peucker from shared/geometry, on paper points: detail finer than `tolerance` cannot be seen in print.
  const drawn = tolerance > 0 ? simplifyRing(onPaper, tolerance) : onPaper;
  drawn.forEach(([x, y], i) => {
    if (i === 0) doc.moveTo(x, y);
    else doc.lineTo(x, y);
  });
  doc.closePath();
}

/** Height of one line of a mirror's label on the plan (7.2 pt type), points. */
export const LABEL_LINE_PT = 9;

const overlaps = (a: Box, b: Box) => a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;

/**
 * Where a label goes: where it was asked for if that is free, else pushed down a line at a time
 * (up to six lines) until it touches no box already taken; if none of those is free, the first
 * spot pushed up a line at a time instead; failing both, where it was asked for.
 */
export function labelSpot(wanted: Box, taken: readonly Box[], maxLines = 6): Box {
  const free = (b: Box) => !taken.some((t) => overlaps(b, t));
  if (free(wanted)) return wanted;
  for (const direction of [1, -1]) {
    for (let n = 1; n <= maxLines; n++) {
      const moved = { ...wanted, y: wanted.y + direction * n * LABEL_LINE_PT };
      if (free(moved)) return moved;
    }
  }
  return wanted;
}

export function drawPlan(doc: PDFKit.PDFDocument, plan: SheetPlan, box: Box, images: SheetImages = {}): PlanFit {
  const fit = fitPlan(plan, box);
  const at = (p: readonly number[]): [number, number] => [
    fit.offsetX + (p[0] - fit.minX) * fit.ptPerM,
    fit.offsetY + (fit.maxY - p[1]) * fit.ptPerM,
  ];

  doc.save();
  doc.rect(box.x, box.y, box.w, box.h).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.rect(box.x, box.y, box.w, box.h).clip();
  /** Boxes already written on (labels, mirror marks): a mirror's label moves off them. */
  const taken: Box[] = [];

  // The customer's plan image under everything, clipped to the frame with the rest.
  const underlayImage = plan.underlay ? images[plan.underlay.fileId] : undefined;
  if (plan.underlay && underlayImage) drawUnderlay(doc, plan.underlay, underlayImage, at);

  // Seen floor first, so walls and labels sit on top of it.
  for (const region of plan.coverage) {
    if (!region.length) continue;
    for (const poly of region) poly.forEach((ring) => ringPath(doc, ring, at, OUTLINE_TOLERANCE_PT));
    doc.fillOpacity(0.2).fillColor(GLASS).fill('even-odd');
    doc.fillOpacity(1);
    for (const poly of region) poly.forEach((ring) => ringPath(doc, ring, at, OUTLINE_TOLERANCE_PT));
    doc.lineWidth(0.4).strokeColor(GLASS).stroke();
  }

  // What no mirror shows of each zone, hatched as on screen.
  for (const z of plan.zones) if (z.gap?.length) hatch(doc, z.gap, at);

  for (const z of plan.zones) {
    ringPath(doc, z.ring, at);
    doc.lineWidth(1.3).dash(4, { space: 2.5 }).strokeColor(zoneColour(z).stroke).stroke();
    doc.undash();
  }

  for (const w of plan.walls) {
    const [ax, ay] = at(w.a);
    const [bx, by] = at(w.b);
    doc.moveTo(ax, ay).lineTo(bx, by);
    if (w.kind === 'door') doc.lineWidth(1).dash(2, { space: 2 }).strokeColor(MUTED).stroke().undash();
    else
      doc
        .lineWidth(w.kind === 'racking' ? 1 : 2)
        .strokeColor(w.kind === 'racking' ? MUTED : INK)
        .stroke();
  }

  // Setting out: each mirror's dimensions as thin lines to the faces (or grid lines) they are taken from.
  for (const m of plan.mirrors) {
    const [mx, my] = at(m.at);
    for (const d of m.dimensions ?? []) {
      const [fx, fy] = at(d.toM);
      const len = Math.hypot(fx - mx, fy - my);
      if (len < 0.5) continue;
      doc.moveTo(mx, my).lineTo(fx, fy).lineWidth(0.5).dash(1.5, { space: 1.5 }).strokeColor(INK).stroke().undash();
      // A short tick across the line where the tape meets the face.
      const ux = (fx - mx) / len;
      const uy = (fy - my) / len;
      doc
        .moveTo(fx - uy * 3, fy + ux * 3)
        .lineTo(fx + uy * 3, fy - ux * 3)
        .lineWidth(0.8)
        .strokeColor(INK)
        .stroke();
    }
  }

  for (const z of plan.zones) {
    const cx = z.ring.reduce((s, p) => s + p[0], 0) / z.ring.length;
    const cy = z.ring.reduce((s, p) => s + p[1], 0) / z.ring.length;
    const [x, y] = at([cx, cy]);
    const label = z.band ? `${z.name}: ${z.covered} seen, ${bandWords[z.band]}` : `${z.name}: ${z.covered} seen`;
    const w = textWidth(doc, 'semibold', 7, label) + 4;
    doc
      .rect(x - w / 2, y - 5, w, 10)
      .fillOpacity(0.85)
      .fillColor(PAPER)
      .fill()
      .fillOpacity(1);
    doc.fillColor(zoneColour(z).text);
    writeText(doc, 'semibold', 7, label, x - w / 2 + 2, y - 3.5, { lineBreak: false });
    taken.push({ x: x - w / 2, y: y - 5, w, h: 10 });
  }

  for (const v of plan.viewers) {
    const [x, y] = at(v.at);
    doc.circle(x, y, 3.2).lineWidth(1).fillColor(PAPER).strokeColor(INK).fillAndStroke();
    doc.circle(x, y, 1.2).fillColor(INK).fill();
    doc.fillColor(INK);
    writeText(doc, 'regular', 6.8, v.name, x + 5, y - 3, { lineBreak: false });
    taken.push({ x: x - 3.2, y: y - 3.2, w: 8.2 + textWidth(doc, 'regular', 6.8, v.name), h: 9 });
  }

  // Every mirror's square and aim tick first, so no mirror's label is written across another mirror.
  const glyphs = plan.mirrors.map((m) => {
    const [x, y] = at(m.at);
    // Page y runs down, plan y runs up: the aim's page direction is (cos az, −sin az).
    const dx = Math.cos(m.azimuthRad);
    const dy = -Math.sin(m.azimuthRad);
    doc
      .moveTo(x, y)
      .lineTo(x + dx * 12, y + dy * 12)
      .lineWidth(0.9)
      .strokeColor(GLASS)
      .stroke();
    doc
      .rect(x - 3, y - 3, 6, 6)
      .fillColor(GLASS)
      .fill();
    const tipX = x + dx * 12;
    const tipY = y + dy * 12;
    const left = Math.min(x - 3, tipX);
    const top = Math.min(y - 3, tipY);
    taken.push({ x: left, y: top, w: Math.max(x + 3, tipX) - left, h: Math.max(y + 3, tipY) - top });
    return { x, y, dx, dy };
  });
  // Wall names and the origin after the mirrors' marks, so they move off them.
  for (const w of plan.walls) {
    if (!w.name) continue;
    const [x, y] = at([(w.a[0] + w.b[0]) / 2, (w.a[1] + w.b[1]) / 2]);
    const tw = textWidth(doc, 'bold', 6.8, w.name) + 4;
    const spot = labelSpot({ x: x - tw / 2, y: y - 4.5, w: tw, h: LABEL_LINE_PT }, taken);
    taken.push(spot);
    doc.rect(spot.x, spot.y, spot.w, 9).lineWidth(0.6).fillColor(PAPER).strokeColor(INK).fillAndStroke();
    doc.fillColor(INK);
    writeText(doc, 'bold', 6.8, w.name, spot.x + 2, spot.y + 1.2, { lineBreak: false });
  }

  if (showsOrigin(plan)) {
    const [ox, oy] = at([0, 0]);
    drawOriginMark(doc, ox, oy);
    doc.fillColor(INK);
    writeText(doc, 'semibold', 6.8, 'Origin 0, 0', ox + 7, oy + 2, { lineBreak: false });
    taken.push({ x: ox - 6, y: oy - 6, w: 12 + 7 + textWidth(doc, 'semibold', 6.8, 'Origin 0, 0'), h: 12 });
  }

  plan.mirrors.forEach((m, i) => {
    const { x, y, dx, dy } = glyphs[i];
    const w = textWidth(doc, 'bold', 7.2, m.label);
    const spot = labelSpot({ x: x - dx * 6 + 4, y: y - dy * 6 - 11, w, h: LABEL_LINE_PT }, taken);
    taken.push(spot);
    doc
      .rect(spot.x - 1.5, spot.y - 1, spot.w + 3, spot.h)
      .fillOpacity(0.85)
      .fillColor(PAPER)
      .fill()
      .fillOpacity(1);
    doc.fillColor(GLASS);
    writeText(doc, 'bold', 7.2, m.label, spot.x, spot.y, { lineBreak: false });
  });
  doc.restore();
  return fit;
}

/** The band's colours (shared/zone-verdict.ts); content issued before bands were kept draws as before, in red. */
function zoneColour(z: SheetPlan['zones'][number]): { stroke: string; text: string } {
  return z.band ? bandColours[z.band] : { stroke: STOP, text: STOP };
}

/** Diagonal hatching inside a region (even-odd), 45° lines every `spacing` points, as the screen's gap pattern. */
export function hatch(doc: PDFKit.PDFDocument, region: MultiPolygon, at: (p: readonly number[]) => [number, number], spacing = 3.5): void {
  const pts = region.flatMap((poly) => poly.flatMap((ring) => ring.map(at)));
  if (!pts.length) return;
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const minX = Math.min(...xs);
  const maxX = Math.max(...xs);
  const minY = Math.min(...ys);
  const maxY = Math.max(...ys);
  doc.save();
  for (const poly of region) poly.forEach((ring) => ringPath(doc, ring, at));
  doc.clip('even-odd');
  for (let c = minX - (maxY - minY); c <= maxX; c += spacing) doc.moveTo(c, maxY).lineTo(c + (maxY - minY), minY);
  doc.lineWidth(0.7).strokeColor(palette.stop).strokeOpacity(0.75).stroke().strokeOpacity(1);
  doc.restore();
}

/** The setting-out datum: a circle with two opposite quarters filled, as on survey drawings. */
export function drawOriginMark(doc: PDFKit.PDFDocument, x: number, y: number, r = 4.5): void {
  doc.circle(x, y, r).lineWidth(0.8).fillColor(PAPER).strokeColor(INK).fillAndStroke();
  // Upper-right and lower-left quarters (page y runs down).
  doc
    .path(`M ${x} ${y} L ${x + r} ${y} A ${r} ${r} 0 0 0 ${x} ${y - r} Z`)
    .fillColor(INK)
    .fill();
  doc
    .path(`M ${x} ${y} L ${x - r} ${y} A ${r} ${r} 0 0 0 ${x} ${y + r} Z`)
    .fillColor(INK)
    .fill();
}

export type { ScaleBar };

/** A bar of a round length (metres or feet), the longest that fits in `maxPt` at the plan's scale (shared/units). */
export function scaleBarFor(fit: PlanFit, units: UnitSystem, maxPt: number): ScaleBar {
  return chooseScaleBar(units, fit.ptPerM, { atMost: maxPt });
}

export function drawScaleBar(doc: PDFKit.PDFDocument, fit: PlanFit, bar: ScaleBar, x: number, y: number): number {
  const len = bar.lengthM * fit.ptPerM;
  const parts = 4;
  for (let i = 0; i < parts; i++) {
    doc
      .rect(x + (i * len) / parts, y, len / parts, 4)
      .lineWidth(0.5)
      .strokeColor(INK);
    if (i % 2 === 0) doc.fillColor(INK).fillAndStroke();
    else doc.stroke();
  }
  doc.font('regular').fontSize(7).fillColor(INK);
  doc.text('0', x - 2, y + 6, { lineBreak: false });
  doc.text(bar.label, x + len - doc.widthOfString(bar.label) / 2, y + 6, { lineBreak: false });
  return len;
}

/**
 * Side view of one mirror, unfolded about the mirror: the viewer's eye on the left at its horizontal
 * distance and height, what the mirror shows on the right, drawn at one scale in both directions.
 */
export function drawElevation(
  doc: PDFKit.PDFDocument,
  el: SheetElevation,
  box: Box,
  fmt: { dist: (m: number) => string; range: (m: number) => string },
): void {
  const rightM = Math.max(el.rangeM, ...el.rays.map((r) => r.reachM), 1);
  const leftM = Math.max(el.eye.distanceM, 0.5);
  const topM = Math.max(el.eye.heightM, el.mirrorHeightM, ...el.rays.map((r) => r.fromHeightM)) + 0.6;
  const padX = 14;
  const padTop = 12;
  const padBottom = 24;
  const s = Math.min((box.w - 2 * padX) / (leftM + rightM), (box.h - padTop - padBottom) / topM);
  const x0 = box.x + padX + leftM * s;
  const floorY = box.y + box.h - padBottom;
  const X = (m: number) => x0 + m * s;
  const Y = (m: number) => floorY - m * s;

  doc.save();
  doc.rect(box.x, box.y, box.w, box.h).lineWidth(0.5).strokeColor(RULE).stroke();
  doc
    .moveTo(box.x + 4, floorY)
    .lineTo(box.x + box.w - 4, floorY)
    .lineWidth(1.2)
    .strokeColor(INK)
    .stroke();

  // The floor the mirror shows, between the nearest and farthest traced rays.
  const reaches = el.rays.filter((r) => r.endHeightM <= 0.001).map((r) => r.reachM);
  if (reaches.length) {
    const a = Math.min(...reaches);
    const b = Math.min(Math.max(...reaches), el.rangeM);
    if (b > a)
      doc
        .rect(X(a), floorY - 3, (b - a) * s, 3)
        .fillOpacity(0.3)
        .fillColor(GLASS)
        .fill()
        .fillOpacity(1);
  }

  // Sightline from the eye to the mirror.
  doc
    .moveTo(X(-el.eye.distanceM), Y(el.eye.heightM))
    .lineTo(X(0), Y(el.mirrorHeightM))
    .lineWidth(0.9)
    .dash(3, { space: 2 })
    .strokeColor(INK)
    .stroke()
    .undash();
  for (const r of el.rays) {
    doc.moveTo(X(0), Y(r.fromHeightM)).lineTo(X(r.reachM), Y(r.endHeightM)).lineWidth(0.9).strokeColor(GLASS).stroke();
  }

  // Mirror: a short thick mark at its height on a post line.
  doc.moveTo(X(0), floorY).lineTo(X(0), Y(el.mirrorHeightM)).lineWidth(0.4).strokeColor(MUTED).stroke();
  doc
    .moveTo(X(0), Y(el.mirrorHeightM) - 5)
    .lineTo(X(0), Y(el.mirrorHeightM) + 5)
    .lineWidth(3)
    .strokeColor(GLASS)
    .stroke();
  // Eye.
  doc.circle(X(-el.eye.distanceM), Y(el.eye.heightM), 3).fillColor(INK).fill();
  doc.moveTo(X(-el.eye.distanceM), floorY).lineTo(X(-el.eye.distanceM), Y(el.eye.heightM)).lineWidth(0.4).strokeColor(MUTED).stroke();

  // Range mark.
  const rx = X(el.rangeM);
  doc
    .moveTo(rx, floorY - 8)
    .lineTo(rx, floorY + 4)
    .lineWidth(1)
    .strokeColor(STOP)
    .stroke();

  // Labels beside the symbols they name, clear of every line drawn (shared/label-placement.ts).
  const eyeAt: [number, number] = [X(-el.eye.distanceM), Y(el.eye.heightM)];
  const mirrorAt: [number, number] = [X(0), Y(el.mirrorHeightM)];
  const segments: Segment[] = [
    [eyeAt, mirrorAt],
    [
      [box.x + 4, floorY],
      [box.x + box.w - 4, floorY],
    ],
    [[eyeAt[0], floorY], eyeAt],
    [
      [mirrorAt[0], floorY],
      [mirrorAt[0], mirrorAt[1] - 5],
    ],
    ...el.rays.map((r): Segment => [
      [X(0), Y(r.fromHeightM)],
      [X(r.reachM), Y(r.endHeightM)],
    ]),
    [
      [rx, floorY - 8],
      [rx, floorY + 4],
    ],
  ];
  const taken: LabelBox[] = [
    { x: eyeAt[0] - 3, y: eyeAt[1] - 3, w: 6, h: 6 },
    { x: mirrorAt[0] - 2, y: mirrorAt[1] - 5, w: 4, h: 10 },
  ];
  const bounds = { x: box.x + 2, y: box.y + 2, w: box.w - 4, h: box.h - 4 };
  const put = (text: string, anchor: [number, number], color: string) => {
    const size = { w: textWidth(doc, 'regular', 7, text), h: 8.5 };
    const spot = placeLabel(anchor, size, { segments, boxes: taken }, bounds, 4);
    taken.push(spot);
    doc.fillColor(color);
    writeText(doc, 'regular', 7, text, spot.x, spot.y + 0.5, { lineBreak: false });
  };
  put(`eye ${fmt.dist(el.eye.heightM)} high`, eyeAt, INK);
  put(`mirror ${fmt.dist(el.mirrorHeightM)} high`, mirrorAt, INK);
  put(`${fmt.dist(el.eye.distanceM)} across the floor`, [(eyeAt[0] + mirrorAt[0]) / 2, floorY], MUTED);
  put(el.rangeCapped ? `view drawn to ${fmt.range(el.rangeM)}` : `adult recognised to ${fmt.range(el.rangeM)}`, [rx, floorY], STOP);
  doc.restore();
}
