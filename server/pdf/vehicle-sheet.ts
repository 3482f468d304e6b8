/**
 * A vehicle job's pages of the specification sheet: the content (plain, formatted data, part of
 * SheetContent and so of its hash) and its drawing. Every number comes from the project's
 * evaluation (shared/project-optics → shared/vehicle/score); this file only picks and formats.
 */
import type { MultiPolygon } from '../../shared/optics';
import {
  formatFieldShare,
  vehicleFieldClass,
  vehicleMirrorId,
  verdictText,
  type ProjectEvaluation,
  type VehicleJobEvaluation,
} from '../../shared/project-optics';
import type { Scene } from '../../shared/schemas';
import { RULE_SETS, STATUS_MARK_MEANING, vehicleGeometry, type StatusMark } from '../../shared/vehicle';
import { VEHICLE_FIELDS_NOTE } from '../../shared/cautions';
import { chooseScaleBar } from '../../shared/units';
import { drawScaleBar, LABEL_LINE_PT, labelSpot, PLAN_SCALES, PT_PER_M, type Box, type PlanFit } from './draw-plan';
import { BEACON, Flow, GLASS, INK, MUTED, PAPER, RULE, STOP } from './layout';
import type { Row, SheetContent, SheetPlacementInput } from './sheet-model';
import { textWidth, writeText } from './text-runs';

type Pt = [number, number];
type Verdict = 'pass' | 'short' | 'no-verdict';

export interface SheetVehicleField {
  name: string;
  /** The regulation's class ("IV", "V extended"), or "—" for fields of other rules, "own" for the installer's. */
  fieldClass: string;
  rule: string;
  /** "[M] from memory, fairly sure" */
  mark: string;
  share: string;
  needed: string;
  verdict: string;
  mirrors: string;
  /** Where in the field a standing adult is detected and recognised (a sampled estimate), or null. */
  criteria: string | null;
  /** Where the pass mark comes from, how far a field to the horizon is scored, what the figures rest on. */
  notes: string[];
}

export interface SheetVehicleTarget {
  name: string;
  seen: string;
  mirror: string;
  image: string;
  insideEdge: string;
  needed: string;
  verdict: string;
}

export interface SheetVehicleDrawing {
  outline: Pt[];
  boxes: { name: string; ring: Pt[] }[];
  eyes: Pt[];
  fields: { short: string; rings: Pt[][]; gaps: MultiPolygon; verdict: Verdict; share: string }[];
  mirrors: { label: string; at: Pt; azimuthRad: number }[];
  targets: { name: string; at: Pt; diameterM: number; passes: boolean }[];
}

export interface SheetVehicle {
  title: string;
  ruleSet: { title: string; description: string };
  dimensions: Row[];
  drawing: SheetVehicleDrawing;
  fields: SheetVehicleField[];
  markMeanings: string[];
  targets: SheetVehicleTarget[];
  mounting: string[];
  mirrors: { label: string; fieldClass: string; serves: string; position: string; height: string; aim: string }[];
  planningNote: string;
  problem: string | null;
}

const KIND_NAMES: Record<NonNullable<Scene['vehicle']>['kind'], string> = {
  'car-van': 'Car or van',
  'bus-coach': 'Bus or coach',
  'rigid-truck': 'Rigid truck',
  'tractor-unit': 'Tractor unit',
  'school-bus': 'School bus',
  'site-machine': 'Site machine',
};

const round3 = (n: number) => Math.round(n * 1000) / 1000;
const pt = (p: readonly number[]): Pt => [round3(p[0]), round3(p[1])];
const markText = (m: StatusMark) => `[${m}] ${STATUS_MARK_MEANING[m]}`;
const ARCMIN = Math.PI / 10800;

interface Formats {
  dist: (m: number) => string;
  size: (m: number) => string;
  fine: (rad: number) => string;
}

/** Minutes of arc as the rules state them ("3.0′"). */
const arcmin = (rad: number) => `${(rad / ARCMIN).toFixed(1)}′`;

export function buildVehicleSheet(
  scene: Scene,
  evaluation: ProjectEvaluation,
  placements: readonly (SheetPlacementInput & { mirrorClass?: string | null; servesFieldIds?: string[] | null })[],
  f: Formats,
): SheetVehicle | undefined {
  const v = scene.vehicle;
  const ev: VehicleJobEvaluation | undefined = evaluation.vehicle;
  if (!v || !ev) return undefined;
  const g = vehicleGeometry(v);
  const labelOf = new Map(placements.map((p) => [vehicleMirrorId(p.id), p.label] as const));
  const fieldName = new Map(ev.fields.map((s) => [s.field.id, s.field.name] as const));

  const fields: SheetVehicleField[] = ev.fields.map((s) => ({
    name: s.field.name,
    fieldClass: vehicleFieldClass(s.field.code),
    rule: s.field.rule,
    mark: markText(s.field.status),
    share: formatFieldShare(s.share),
    needed: s.field.requiredShare === null ? 'none stated' : `${Math.round(s.field.requiredShare * 100)} %`,
    verdict: verdictText(s.verdict),
    mirrors: s.mirrorIds.length ? s.mirrorIds.map((id) => labelOf.get(id) ?? id).join(', ') : 'no mirror serves it',
    criteria: s.criteria
      ? `A standing adult in it is detected over ${formatFieldShare(s.criteria.detectShare)} of it and recognised over ${formatFieldShare(s.criteria.recogniseShare)} (estimated at ${s.criteria.sampled} points).`
      : null,
    notes: [s.field.requiredShareBasis, s.field.basis, ...(s.field.scoredToNote ? [s.field.scoredToNote] : [])],
  }));

  const targets: SheetVehicleTarget[] = ev.targets.map((t) => {
    const target = v.targets.find((x) => x.id === t.targetId);
    const needed = target
      ? [
          `${arcmin(target.insideEdgeRad)} inside the edge`,
          ...(target.minShortRad !== null || target.minLongRad !== null
            ? [`image at least ${arcmin(target.minShortRad ?? 0)} × ${arcmin(target.minLongRad ?? 0)}`]
            : []),
        ].join('; ')
      : '—';
    return {
      name: t.name,
      seen: t.whollyVisible ? 'wholly' : t.visible ? 'in part' : 'not seen',
      mirror: t.mirrorId ? (labelOf.get(t.mirrorId) ?? t.mirrorId) : '—',
      image:
        t.heightAngleRad !== null && t.widthAngleRad !== null ? `${arcmin(t.heightAngleRad)} high × ${arcmin(t.widthAngleRad)} wide` : '—',
      insideEdge: t.insideEdgeRad !== null ? arcmin(t.insideEdgeRad) : '—',
      needed,
      verdict: t.passes ? 'pass' : 'short',
    };
  });

  const eye = g.eyeMidM;
  const dimensions: Row[] = [
    ['Kind and drive', `${KIND_NAMES[v.kind]}, ${v.driverSide === 'right' ? 'right' : 'left'}-hand drive`],
    ['Length × width without mirrors', `${f.dist(v.lengthM)} × ${f.dist(v.widthM)}`],
    ['Cab width; cab front behind the bumper', `${f.dist(v.cabWidthM)}; ${f.dist(v.cabFrontBehindM)}`],
    [
      'Driver’s eyes (midpoint)',
      `${f.dist(-eye[0])} behind the front, ${f.dist(Math.abs(eye[1]))} from the centreline, ${f.dist(eye[2])} up` +
        (v.eye.method === 'seat'
          ? ` (seat point plus the ${v.eye.rule === 'un-r46' ? 'UN R46' : 'ISO 5006'} offset)`
          : ' (typed directly)'),
    ],
    ['Body parts', v.bodyBoxes.length ? v.bodyBoxes.map((b) => `${b.name} ${f.dist(b.heightM)} high`).join('; ') : 'none described'],
  ];

  const drawing: SheetVehicleDrawing = {
    outline: g.outline.map(pt),
    boxes: g.boxes.map((b) => ({ name: b.box.name, ring: b.ring.map(pt) })),
    eyes: g.ocularM.map(pt),
    fields: ev.fields.map((s) => ({
      short: shortFieldLabel(s.field.code, s.field.side === null ? null : s.field.side === g.driverSide ? 'D' : 'P', s.field.name),
      rings: s.field.polygonM.map((ring) => ring.map(pt)),
      gaps: s.gapsM.map((poly) => poly.map((ring) => ring.map(pt))),
      verdict: s.verdict,
      share: formatFieldShare(s.share),
    })),
    mirrors: placements.map((p) => ({ label: p.label, at: pt(p.positionM), azimuthRad: round3(p.azimuthRad) })),
    targets: v.targets.map((t) => ({
      name: t.name,
      at: pt(t.positionM),
      diameterM: t.diameterM,
      passes: ev.targets.find((x) => x.targetId === t.id)?.passes ?? false,
    })),
  };

  return {
    title: `${KIND_NAMES[v.kind]}, ${v.driverSide}-hand drive`,
    ruleSet: RULE_SETS[ev.ruleSet],
    dimensions,
    drawing,
    fields,
    markMeanings: (['P', 'M', 'M?', 'D'] as const).map(markText),
    targets,
    mounting: ev.mounting.map((m) => m.sentence),
    mirrors: placements.map((p) => ({
      label: p.label,
      fieldClass: p.mirrorClass ?? 'not stated',
      serves: p.servesFieldIds
        ? p.servesFieldIds.map((id) => fieldName.get(id) ?? `${id} (not among this vehicle’s fields)`).join('; ')
        : 'every field',
      position: `${f.dist(Math.abs(p.positionM[0]))} ${p.positionM[0] <= 0 ? 'behind' : 'ahead of'} the front, ${f.dist(Math.abs(p.positionM[1]))} ${p.positionM[1] >= 0 ? 'left' : 'right'} of the centreline`,
      height: f.dist(p.heightM),
      aim: f.fine(p.azimuthRad),
    })),
    planningNote: VEHICLE_FIELDS_NOTE,
    problem: ev.problem,
  };
}

/** "IV-P", "V-P", "VI", "own: Kerb strip": the label a field carries on the drawing. */
function shortFieldLabel(code: string, side: 'D' | 'P' | null, name: string): string {
  const cls = vehicleFieldClass(code as Parameters<typeof vehicleFieldClass>[0]);
  if (code === 'user') return name;
  if (cls === '—') return name;
  return side ? `${cls.replace(' extended', '+')}-${side}` : cls;
}

// ---------------------------------------------------------------------------------------------
// Drawing

/** Plan metres a close-up shows. */
export interface Window {
  minX: number;
  maxX: number;
  minY: number;
  maxY: number;
}

/** The close-up around the cab: the mirrors and the eyes, with 3 m round them. */
export function cabWindow(d: SheetVehicleDrawing): Window {
  const pts = [...d.mirrors.map((m) => m.at), ...d.eyes];
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const pad = 3;
  return { minX: Math.min(...xs) - pad, maxX: Math.max(...xs) + pad, minY: Math.min(...ys) - pad, maxY: Math.max(...ys) + pad };
}

/** The top view: the vehicle pointing up the page, its right side to the right. */
function fitTop(d: SheetVehicleDrawing, box: Box, window: Window | null): PlanFit & { at: (p: readonly number[]) => Pt } {
  const pts: Pt[] = window
    ? [
        [window.minX, window.minY],
        [window.maxX, window.maxY],
      ]
    : [...d.outline, ...d.fields.flatMap((fl) => fl.rings.flat()), ...d.targets.map((t) => t.at), ...d.mirrors.map((m) => m.at)];
  // Page across = −y (the vehicle's right to the right), page up = x (forward).
  const us = pts.map((p) => -p[1]);
  const vs = pts.map((p) => p[0]);
  const margin = window ? 0 : 1;
  const uMin = Math.min(...us) - margin;
  const uMax = Math.max(...us) + margin;
  const vMin = Math.min(...vs) - margin;
  const vMax = Math.max(...vs) + margin;
  const spanU = Math.max(uMax - uMin, 1);
  const spanV = Math.max(vMax - vMin, 1);
  const denominator =
    PLAN_SCALES.find((n) => (spanU * PT_PER_M) / n <= box.w && (spanV * PT_PER_M) / n <= box.h) ?? PLAN_SCALES[PLAN_SCALES.length - 1];
  const ptPerM = PT_PER_M / denominator;
  const offsetX = box.x + (box.w - spanU * ptPerM) / 2;
  const offsetY = box.y + (box.h - spanV * ptPerM) / 2;
  return {
    denominator,
    ptPerM,
    minX: uMin,
    maxY: vMax,
    offsetX,
    offsetY,
    heightPt: spanV * ptPerM,
    at: (p) => [offsetX + (-p[1] - uMin) * ptPerM, offsetY + (vMax - p[0]) * ptPerM],
  };
}

function path(doc: PDFKit.PDFDocument, ring: readonly (readonly number[])[], at: (p: readonly number[]) => Pt): void {
  ring.forEach((p, i) => {
    const [x, y] = at(p);
    if (i === 0) doc.moveTo(x, y);
    else doc.lineTo(x, y);
  });
  doc.closePath();
}

const verdictColour = (v: Verdict) => (v === 'pass' ? GLASS : v === 'short' ? STOP : MUTED);

/**
 * Draws the top view in `box` (the whole of it, or only `window`, a close-up); mirror labels only
 * when `mirrorLabels`. Returns the fit for the scale bar.
 */
export function drawVehicleTop(
  doc: PDFKit.PDFDocument,
  d: SheetVehicleDrawing,
  box: Box,
  opts: { window?: Window | null; mirrorLabels?: boolean } = {},
): PlanFit {
  const fit = fitTop(d, box, opts.window ?? null);
  const { at } = fit;
  doc.save();
  doc.rect(box.x, box.y, box.w, box.h).lineWidth(0.5).strokeColor(RULE).stroke();
  doc.rect(box.x, box.y, box.w, box.h).clip();

  // Gaps: hatched in the field's verdict colour, clipped to the gap.
  for (const fl of d.fields) {
    if (!fl.gaps.length) continue;
    doc.save();
    for (const poly of fl.gaps) poly.forEach((ring) => path(doc, ring, at));
    doc.clip('even-odd');
    const step = 3.2;
    doc.lineWidth(0.5).strokeColor(verdictColour(fl.verdict));
    for (let s = -box.h; s < box.w + box.h; s += step) doc.moveTo(box.x + s, box.y).lineTo(box.x + s - box.h, box.y + box.h);
    doc.stroke();
    doc.restore();
  }
  // Field outlines.
  for (const fl of d.fields) {
    fl.rings.forEach((ring) => path(doc, ring, at));
    doc.lineWidth(1).dash(4, { space: 2 }).strokeColor(verdictColour(fl.verdict)).stroke();
    doc.undash();
  }
  // The vehicle: outline, then the body parts.
  path(doc, d.outline, at);
  doc.lineWidth(1.2).strokeColor(INK).stroke();
  for (const b of d.boxes) {
    path(doc, b.ring, at);
    doc.fillOpacity(0.12).fillColor(INK).fill();
    doc.fillOpacity(1);
    path(doc, b.ring, at);
    doc.lineWidth(0.5).strokeColor(INK).stroke();
  }
  for (const e of d.eyes) {
    const [x, y] = at(e);
    doc.circle(x, y, 1.4).fillColor(INK).fill();
  }
  for (const t of d.targets) {
    const [x, y] = at(t.at);
    doc
      .circle(x, y, Math.max(2, (t.diameterM / 2) * fit.ptPerM))
      .lineWidth(1)
      .strokeColor(t.passes ? GLASS : STOP)
      .stroke();
  }

  const taken: Box[] = [];
  const glyphs = d.mirrors.map((m) => {
    const [x, y] = at(m.at);
    // Plan (cos az, sin az) → page (−sin az, −cos az): across is −y, up the page is +x.
    const dx = -Math.sin(m.azimuthRad);
    const dy = -Math.cos(m.azimuthRad);
    doc
      .moveTo(x, y)
      .lineTo(x + dx * 10, y + dy * 10)
      .lineWidth(0.9)
      .strokeColor(BEACON)
      .stroke();
    doc
      .rect(x - 2.5, y - 2.5, 5, 5)
      .fillColor(BEACON)
      .fill();
    taken.push({ x: x - 3, y: y - 3, w: 6, h: 6 });
    return { x, y };
  });
  // Field labels, then mirror labels, each moved off what is already written.
  for (const fl of d.fields) {
    const ring = fl.rings[0];
    const xs = ring.map((p) => at(p)[0]);
    const ys = ring.map((p) => at(p)[1]);
    const cx = (Math.min(...xs) + Math.max(...xs)) / 2;
    const cy = (Math.min(...ys) + Math.max(...ys)) / 2;
    // A close-up labels only the fields whose middle it shows.
    if (cx < box.x || cx > box.x + box.w || cy < box.y || cy > box.y + box.h) continue;
    const label = `${fl.short}: ${fl.share}`;
    const w = textWidth(doc, 'semibold', 6.8, label) + 4;
    const spot = labelSpot({ x: cx - w / 2, y: cy - 4.5, w, h: LABEL_LINE_PT }, taken);
    taken.push(spot);
    doc.rect(spot.x, spot.y, spot.w, spot.h).fillOpacity(0.85).fillColor(PAPER).fill().fillOpacity(1);
    doc.fillColor(verdictColour(fl.verdict));
    writeText(doc, 'semibold', 6.8, label, spot.x + 2, spot.y + 1, { lineBreak: false });
  }
  d.mirrors.forEach((m, i) => {
    if (!opts.mirrorLabels) return;
    const { x, y } = glyphs[i];
    const w = textWidth(doc, 'bold', 6.5, m.label);
    const right = x > box.x + box.w / 2;
    const spot = labelSpot({ x: right ? x + 6 : x - 6 - w, y: y - 4.5, w, h: LABEL_LINE_PT }, taken);
    taken.push(spot);
    doc.fillColor(INK);
    writeText(doc, 'bold', 6.5, m.label, spot.x, spot.y + 1, { lineBreak: false });
  });
  doc.restore();
  return fit;
}

/** The vehicle pages: the top view, the fields, the test cylinders, the mounting sentences and the mirrors. */
export function vehiclePages(flow: Flow, content: SheetContent, sv: SheetVehicle, paperName: string, cautions: (flow: Flow) => void): void {
  flow.newPage();
  flow.style('semibold', 8.5, GLASS).text('VEHICLE', flow.left, flow.y, { characterSpacing: 1, lineBreak: false });
  flow.y += 13;
  flow.paragraph(sv.title, 'bold', 16, INK);
  flow.gap(4);
  flow.paragraph(`Scored against: ${sv.ruleSet.title}. ${sv.ruleSet.description}`, 'regular', 9, INK);
  flow.gap(4);
  flow.rows(sv.dimensions, 0.36);
  flow.gap(4);
  flow.paragraph(sv.planningNote, 'semibold', 9, BEACON);

  flow.heading('Top view: the fields, what the mirrors leave unseen (hatched) and the mirrors', 220);
  const legend =
    'Legend: the vehicle points up the page, its right side to the right; left, the whole of it, right, a close-up around the cab. Dashed outline — a field the rules ask to be seen, blue where it passes, red where it is short, grey where the rule gives no pass mark, labelled with its class, side (D driver’s, P passenger) and share seen; hatching — the part of a field no chosen mirror shows; shaded boxes — body parts that block sightlines; black dots — the driver’s two eye points; orange square with a tick — a mirror and its aim; circles — test cylinders (blue seen as required, red not).';
  const legendH = flow.textHeight(legend, 'regular', 7.5, flow.width) + 34;
  const gap = 12;
  const w = (flow.width - gap) / 2;
  const h = Math.max(180, Math.min(flow.room - legendH, 470));
  const whole = { x: flow.left, y: flow.y, w, h };
  const close = { x: flow.left + w + gap, y: flow.y, w, h };
  const fits = [
    drawVehicleTop(flow.doc, sv.drawing, whole, { mirrorLabels: false }),
    drawVehicleTop(flow.doc, sv.drawing, close, { window: cabWindow(sv.drawing), mirrorLabels: true }),
  ];
  flow.y += h + 8;
  [whole, close].forEach((b, i) => {
    const bar = chooseScaleBar(content.units, fits[i].ptPerM, { atMost: w * 0.4 });
    const barLen = drawScaleBar(flow.doc, fits[i], bar, b.x + 2, flow.y + 2);
    flow
      .style('semibold', 8, INK)
      .text(`1:${fits[i].denominator} on ${paperName} at 100 %`, b.x + barLen + 18, flow.y, { lineBreak: false });
  });
  flow.y += 24;
  flow.paragraph(legend, 'regular', 7.5, INK);

  flow.newPage();
  flow.heading('Ground fields: share seen and verdict');
  if (sv.problem) flow.paragraph(`The fields could not be scored: ${sv.problem}`, 'medium', 9.5, STOP);
  if (!sv.fields.length) {
    flow.paragraph(
      'These rules set no ground field for this kind of vehicle; the test cylinders below are the check.',
      'regular',
      9,
      MUTED,
    );
  } else {
    flow.table(
      [
        { title: 'Field', width: 0.27 },
        { title: 'Class', width: 0.07 },
        { title: 'Rule', width: 0.2 },
        { title: 'Status mark', width: 0.2 },
        { title: 'Share seen', width: 0.09, align: 'right' },
        { title: 'Needed', width: 0.08, align: 'right' },
        { title: 'Verdict', width: 0.09 },
      ],
      sv.fields.map((fl) => [fl.name, fl.fieldClass, fl.rule, fl.mark, fl.share, fl.needed, fl.verdict]),
    );
    flow.gap(3);
    flow.paragraph(
      `Status marks: ${sv.markMeanings.join('; ')}. Share seen: the part of the field some mirror chosen for it shows from either eye point where the rule counts both (one eye point where it names one), the body blocking sightlines; rounded down to 0.1 %. Detected and recognised: ${content.criteria.detect} and ${content.criteria.recognise} (${content.criteria.basis}).`,
      'regular',
      8,
      MUTED,
    );
    flow.heading('Field by field');
    for (const fl of sv.fields) {
      flow.paragraph(
        `${fl.name} — class ${fl.fieldClass}, ${fl.rule}: ${fl.share} seen, ${fl.needed === 'none stated' ? 'no pass mark stated' : `${fl.needed} needed`}, ${fl.verdict}.`,
        'semibold',
        9,
        fl.verdict === 'short' ? STOP : INK,
      );
      flow.paragraph(`Mirrors counted: ${fl.mirrors}. ${fl.criteria ? `${fl.criteria} ` : ''}${fl.notes.join(' ')}`, 'regular', 8, MUTED);
      flow.gap(3);
    }
  }

  flow.heading('Test cylinders');
  if (!sv.targets.length) flow.paragraph('No test cylinders are placed on this job.', 'regular', 9, MUTED);
  else
    flow.table(
      [
        { title: 'Cylinder', width: 0.22 },
        { title: 'Seen', width: 0.09 },
        { title: 'Best mirror', width: 0.17 },
        { title: 'Image', width: 0.16 },
        { title: 'Inside the edge', width: 0.1, align: 'right' },
        { title: 'Needed', width: 0.18 },
        { title: 'Verdict', width: 0.08 },
      ],
      sv.targets.map((t) => [t.name, t.seen, t.mirror, t.image, t.insideEdge, t.needed, t.verdict]),
    );

  flow.heading('Mounting');
  if (!sv.mounting.length) flow.paragraph('No mounting check raised anything for these mirrors.', 'regular', 9, MUTED);
  for (const s of sv.mounting) {
    flow.paragraph(`• ${s}`, 'regular', 9, INK);
    flow.gap(2);
  }

  flow.heading('Mirrors on the vehicle');
  flow.table(
    [
      { title: 'Mirror', width: 0.18 },
      { title: 'Class', width: 0.08 },
      { title: 'Counts toward', width: 0.3 },
      { title: 'Position', width: 0.26 },
      { title: 'Height', width: 0.09, align: 'right' },
      { title: 'Aim', width: 0.09, align: 'right' },
    ],
    sv.mirrors.map((m) => [m.label, m.fieldClass, m.serves, m.position, m.height, m.aim]),
  );
  flow.gap(2);
  flow.paragraph(
    'Each mirror’s own numbers (focal length, field of view, how much farther things look, recognisable range) follow on its page, seen from the midpoint of the driver’s eyes.',
    'regular',
    8,
    MUTED,
  );
  flow.gap(6);
  cautions(flow);
}
