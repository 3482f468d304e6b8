/**
 * The specification sheet's content as plain data: everything the PDF shows, already sorted and
 * formatted in the reader's units, and nothing that changes between two renders of the same job
 * (no revision number, no date, no reader). Its SHA-256 over a canonical JSON is the content hash
 * that decides whether a new revision is issued.
 *
 * Every number comes from `evaluateProject` (shared/project-optics), i.e. the same engine the screens
 * use; this file only picks and formats.
 */
import { mirrorKindName } from '../../shared/mirror-labels';
import { createHash } from 'node:crypto';
import { fanRays, sphereRadiusM, type MultiPolygon } from '../../shared/optics';
import {
  MAX_DRAWN_RANGE_M,
  criteriaBasisText,
  criteriaOf,
  criterionText,
  drawnRangeM,
  evaluateProject,
  plausibilitySentences,
  targetLabel,
  zoneCriterion,
  type ProjectEvaluation,
} from '../../shared/project-optics';
import type { CatalogueItemDto, MirrorSpec, PlacementDto, Scene, SheetPaper, Underlay, UnitSystem } from '../../shared/schemas';
import {
  formatAngle,
  formatArea,
  formatLength,
  formatMoney,
  formatNumber,
  formatPercent,
  formatRange,
  resolveUnits,
} from '../../shared/units';
import { formatCoveredShare, zoneBand, type ZoneBand } from '../../shared/zone-verdict';
import { describeDimension, locate, wallNames, type Dimension } from '../../shared/datum';
import { uncoveredPart } from '../../shared/geometry/uncovered';
import { SHEET_CAUTIONS } from './cautions';
import { buildVehicleSheet, type SheetVehicle } from './vehicle-sheet';

export type SheetPlacementInput = Pick<
  PlacementDto,
  'id' | 'label' | 'catalogueItemId' | 'customMirror' | 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad' | 'viewerId' | 'notes'
> &
  Partial<Pick<PlacementDto, 'mirrorClass' | 'servesFieldIds'>>;

export interface SheetInput {
  project: {
    id: number;
    name: string;
    customer: string;
    site: string;
    kind: string;
    notes: string;
    units: UnitSystem | null;
    scene: Scene;
  };
  owner: { name: string; email: string; units: UnitSystem };
  organization: string;
  placements: readonly SheetPlacementInput[];
  catalogue: readonly CatalogueItemDto[];
  /** Uploaded files the sheet shows: the plan underlay's image and each mirror's newest photo (absent: none). */
  files?: SheetFilesInput;
}

export interface SheetFileRef {
  fileId: string;
  widthPx: number;
  heightPx: number;
}

export interface SheetFilesInput {
  /** The image `scene.underlay` names, when it is one of this job's plans. */
  underlay?: SheetFileRef | null;
  /** Each mirror's newest photo. */
  photos?: (SheetFileRef & { placementId: number; name: string; takenOn: string })[];
}

export type Row = [label: string, value: string];

export interface SheetReference {
  objectDistance: string;
  magnification: string;
  trueDistance: string;
  sizeCueDistance: string;
  ratio: string;
}

export interface SheetNumbers {
  /** Field of view for an eye on the mirror's axis: a property of the mirror, always printed as "on axis". */
  fovOnAxisHorizontal: string;
  fovOnAxisVertical: string;
  eyeDistance: string;
  /** How far this viewer's eye is off the mirror's axis. */
  eyeOffAxis: string;
  references: SheetReference[];
  /** Farthest distance, mirror to person, at which each target is detected / recognised. */
  rangeAdultDetect: string;
  rangeAdultRecognise: string;
  rangeChildDetect: string;
  rangeChildRecognise: string;
  rimSqueeze: string;
  /** The floor this viewer sees (walls included, out to the adult recognise range). */
  floorArea: string;
  floorSpread: string;
  floorReach: string;
}

/** Side view, unfolded: the viewer to the left of the mirror, what the mirror shows to the right. Metres. */
export interface SheetElevation {
  eye: { distanceM: number; heightM: number };
  mirrorHeightM: number;
  /** Two reflected rays: from the mirror (height) to a point `reachM` away at height `endHeightM`. */
  rays: { fromHeightM: number; reachM: number; endHeightM: number }[];
  rangeM: number;
  /** True when the adult recognise range is longer than the drawing limit and the view is cut there. */
  rangeCapped: boolean;
}

export interface SheetPlacement {
  label: string;
  mirror: Row[];
  mounting: Row[];
  numbers: SheetNumbers | null;
  problem: string | null;
  /** Plausibility sentences (a mirror above the walls it hangs on, an eye behind it); absent when there are none. */
  plausibility?: string[];
  elevation: SheetElevation | null;
  notes: string;
  /** The mirror's newest photo (uploaded as mounted); absent when it has none. */
  photo?: SheetFileRef & { name: string; takenOn: string };
}

/** One dimension that sets a mirror out on site (shared/datum.ts), drawn from the mirror to `toM`. */
export interface SheetDimension {
  text: string;
  toM: [number, number];
  /** The wall's name ("W3") when measured from a wall; null from a grid line. */
  wall: string | null;
}

export interface SheetPlan {
  walls: { kind: string; a: [number, number]; b: [number, number]; name?: string | null }[];
  /** `band` and `gap` are absent in content issued before they were kept (older revisions). */
  zones: { name: string; ring: [number, number][]; covered: string; band?: ZoneBand; gap?: MultiPolygon | null }[];
  viewers: { name: string; at: [number, number] }[];
  mirrors: { label: string; at: [number, number]; azimuthRad: number; dimensions?: SheetDimension[] }[];
  coverage: MultiPolygon[];
  /** The plan image drawn under the plan at its calibrated scale (shared/geometry/underlay.ts); absent when none. */
  underlay?: SheetFileRef & Underlay;
}

export interface SheetPurchaseLine {
  code: string;
  description: string;
  quantity: number;
  unitPrice: string;
  lineTotal: string;
  currency: string;
}

export interface SheetContent {
  format: 2;
  projectId: number;
  project: { name: string; customer: string; site: string; kind: string; notes: string };
  installer: { name: string; email: string; organization: string };
  units: UnitSystem;
  cautions: readonly string[];
  /** The project's two criteria as printed ("6′ of the person's height") and the sentence stating their basis. */
  criteria: { detect: string; recognise: string; basis: string };
  zones: { name: string; target: string; criterion: string; covered: string; area: string; problem: string | null }[];
  placements: SheetPlacement[];
  plan: SheetPlan;
  purchase: { lines: SheetPurchaseLine[]; totals: { currency: string; total: string }[]; onRequest: number };
  /** A vehicle job's pages (server/pdf/vehicle-sheet.ts); absent for a site, so a site's content is unchanged. */
  vehicle?: SheetVehicle;
}

/** The mounting row the summary table reads the height from. */
export const MOUNT_HEIGHT_LABEL = 'Height of the mirror centre';

/** The formatters the sheet uses for each kind of number; tests format engine values with these too. */
export function sheetFormat(units: UnitSystem) {
  return {
    dist: (m: number) => formatLength(m, units, { kind: 'distance' }),
    /** A detect / recognise range: down to a tape step (shared/units/tape.ts). */
    range: (m: number) => formatRange(m, units),
    size: (m: number) => formatLength(m, units, { kind: 'size' }),
    angle: (rad: number) => formatAngle(rad),
    fine: (rad: number) => formatAngle(rad, { precision: 1 }),
    magnification: (m: number) => `×${formatNumber(m, 3)}`,
    ratio: (r: number) => `${formatNumber(r, 1)}×`,
    percent: (f: number) => formatPercent(f),
    area: (m2: number) => formatArea(m2, units),
    money: (minor: number, currency: string) => formatMoney(minor, currency, 'en'),
  };
}

const round3 = (n: number) => Math.round(n * 1000) / 1000;
const pt = (p: readonly number[]): [number, number] => [round3(p[0]), round3(p[1])];

function shapeText(spec: MirrorSpec): string {
  return mirrorKindName(spec);
}

function sizeText(spec: MirrorSpec, size: (m: number) => string): string {
  if (spec.shape === 'rect') return `${size(spec.widthM)} wide × ${size(spec.heightM)} high`;
  return `${size(spec.diameterM)} diameter`;
}

function specOf(
  p: SheetPlacementInput,
  catalogue: readonly CatalogueItemDto[],
): { spec: MirrorSpec | null; item: CatalogueItemDto | null } {
  if (p.customMirror) return { spec: p.customMirror, item: null };
  const item = catalogue.find((c) => c.id === p.catalogueItemId) ?? null;
  return { spec: item?.mirror ?? null, item };
}

function elevationOf(ev: ProjectEvaluation['placements'][number]): SheetElevation | null {
  if (!ev.mirror || !ev.pose || !ev.eyeM || !ev.numbers) return null;
  const v = ev.pose.vertexM;
  const rangeM = drawnRangeM(ev.numbers);
  let rays: ReturnType<typeof fanRays>;
  try {
    rays = fanRays({ mirror: ev.mirror, pose: ev.pose, eyeM: ev.eyeM, maxRangeM: Math.max(rangeM, 0.1), samples: 32 });
  } catch {
    // The engine refuses this geometry (e.g. the eye behind the mirror); the numbers table says why.
    return null;
  }
  const reach = (r: (typeof rays)[number]) => Math.hypot(r.toM[0] - v[0], r.toM[1] - v[1]);
  const sorted = [...rays].sort((a, b) => reach(a) - reach(b));
  const picked = sorted.length ? [sorted[0], sorted[sorted.length - 1]] : [];
  return {
    eye: { distanceM: round3(Math.hypot(ev.eyeM[0] - v[0], ev.eyeM[1] - v[1])), heightM: round3(ev.eyeM[2]) },
    mirrorHeightM: round3(v[2]),
    rays: picked.map((r) => ({ fromHeightM: round3(r.fromM[2]), reachM: round3(reach(r)), endHeightM: round3(r.toM[2]) })),
    rangeM: round3(rangeM),
    rangeCapped: ev.numbers.rangesM.recognise.adult > MAX_DRAWN_RANGE_M,
  };
}

export interface BuiltSheet {
  content: SheetContent;
  evaluation: ProjectEvaluation;
  /** Placements in sheet order, matching `evaluation.placements`. */
  placements: SheetPlacementInput[];
}

/** The mirror's newest photo, as a spread-in field (nothing when it has none, so older content is unchanged). */
function photoOf(files: SheetFilesInput | undefined, placementId: number): { photo?: SheetPlacement['photo'] } {
  const photo = files?.photos?.find((f) => f.placementId === placementId);
  return photo
    ? { photo: { fileId: photo.fileId, widthPx: photo.widthPx, heightPx: photo.heightPx, name: photo.name, takenOn: photo.takenOn } }
    : {};
}

/** The scene's underlay with its image's size, when the image is one of this job's plans. */
function underlayOf(scene: Scene, files: SheetFilesInput | undefined): { underlay?: SheetPlan['underlay'] } {
  const u = scene.underlay;
  const file = files?.underlay;
  if (!u || !file || file.fileId !== u.fileId) return {};
  return { underlay: { ...u, widthPx: file.widthPx, heightPx: file.heightPx } };
}

export function buildSheetContent(input: SheetInput): BuiltSheet {
  const units = resolveUnits(input.project.units, input.owner.units);
  const f = sheetFormat(units);
  const scene = input.project.scene;
  const placements = [...input.placements].sort((a, b) => a.label.localeCompare(b.label, 'en') || a.id - b.id);
  const evaluation = evaluateProject({ scene, placements, catalogue: input.catalogue });
  const criteria = criteriaOf(scene);
  const names = wallNames(scene.walls);
  const dimensions: SheetDimension[][] = placements.map((p) =>
    locate(p.positionM, scene.walls).map((d: Dimension) => ({
      text: describeDimension(d, f.dist),
      toM: pt(d.footM),
      wall: d.kind === 'wall' ? d.name : null,
    })),
  );
  const measuredFrom = new Set(dimensions.flat().map((d) => d.wall));

  const sheetPlacements: SheetPlacement[] = placements.map((p, i) => {
    const ev = evaluation.placements[i];
    const { spec, item } = specOf(p, input.catalogue);
    const viewer = scene.viewers.find((v) => v.id === p.viewerId) ?? null;
    const mirror: Row[] = spec
      ? [
          ['Mirror', item ? `${item.code} — ${item.name}` : 'Custom mirror (not from the catalogue)'],
          ['Shape', shapeText(spec)],
          ['Size', sizeText(spec, f.size)],
          ['Radius of curvature', ev.mirror ? f.size(sphereRadiusM(ev.mirror)) : '—'],
          ['Focal length', ev.numbers ? f.size(ev.numbers.focalLengthM) : '—'],
          ['Material', item?.material || 'not stated'],
        ]
      : [['Mirror', 'No mirror chosen']];
    const mounting: Row[] = [
      ...dimensions[i].map((d, k): Row => [k === 0 ? 'Set out on site from' : 'and from', d.text]),
      ['Position on the plan', `x ${f.dist(p.positionM[0])}, y ${f.dist(p.positionM[1])}`],
      [MOUNT_HEIGHT_LABEL, f.dist(p.heightM)],
      ['Aim (azimuth from plan x toward y)', f.fine(p.azimuthRad)],
      ['Tilt down from level', f.fine(p.tiltDownRad)],
      scene.vehicle
        ? ['Viewer served', `the driver’s eyes, ${f.dist(ev.eyeM?.[2] ?? 0)} up`]
        : ['Viewer served', viewer ? `${viewer.name}, eye at ${f.dist(viewer.eyeHeightM)}` : 'none chosen'],
    ];
    const n = ev.numbers;
    const numbers: SheetNumbers | null = n
      ? {
          fovOnAxisHorizontal: f.angle(n.onAxisFieldOfView.horizontalRad),
          fovOnAxisVertical: f.angle(n.onAxisFieldOfView.verticalRad),
          eyeDistance: f.dist(n.eyeDistanceM),
          eyeOffAxis: f.angle(n.eyeOffAxisRad),
          references: n.references.map((r) => ({
            objectDistance: f.dist(r.objectDistanceM),
            magnification: f.magnification(r.magnification),
            trueDistance: f.dist(r.trueDistanceM),
            sizeCueDistance: f.dist(r.sizeCueDistanceM),
            ratio: f.ratio(r.ratio),
          })),
          rangeAdultDetect: f.range(n.rangesM.detect.adult),
          rangeAdultRecognise: f.range(n.rangesM.recognise.adult),
          rangeChildDetect: f.range(n.rangesM.detect.child),
          rangeChildRecognise: f.range(n.rangesM.recognise.child),
          rimSqueeze: n.rimSqueeze > 0 ? f.percent(n.rimSqueeze) : 'rim out of sight',
          floorArea: ev.coverage ? f.area(ev.coverage.areaM2) : '—',
          floorSpread: n.floorSeen ? f.angle(n.floorSeen.spreadRad) : 'no floor seen',
          floorReach: n.floorSeen ? `${f.dist(n.floorSeen.nearestM)} to ${f.dist(n.floorSeen.farthestM)}` : 'no floor seen',
        }
      : null;
    const doubts = plausibilitySentences({ label: p.label, mirror: ev.mirror, placement: p, scene, units });
    return {
      label: p.label,
      mirror,
      mounting,
      numbers,
      problem: ev.problem?.message ?? null,
      // Absent rather than empty, so a sheet without doubts keeps the content hash it had before.
      ...(doubts.length > 0 ? { plausibility: doubts } : {}),
      elevation: elevationOf(ev),
      notes: p.notes.trim(),
      ...photoOf(input.files, p.id),
    };
  });

  const zones = scene.zones.map((z, i) => {
    const ez = evaluation.zones[i];
    const ok = Number.isFinite(ez.fraction);
    return {
      name: z.name,
      target: targetLabel(z.target),
      criterion: zoneCriterion(z),
      covered: ok ? formatCoveredShare(ez.fraction) : '—',
      area: ok ? f.area(ez.coveredM2) : '—',
      problem: ok ? null : 'not computable',
    };
  });

  const plan: SheetPlan = {
    // Only the walls a dimension is taken from are named on the plan: a thousand names would hide it.
    walls: scene.walls.map((w, i) => ({ kind: w.kind, a: pt(w.aM), b: pt(w.bM), name: measuredFrom.has(names[i]) ? names[i] : null })),
    zones: scene.zones.map((z, i) => {
      const ez = evaluation.zones[i];
      const gap = ez.problem ? null : uncoveredPart(z.polygonM, [ez.covered], z.name);
      return {
        name: z.name,
        ring: z.polygonM.map(pt),
        covered: zones[i].covered,
        band: zoneBand(ez.fraction),
        gap: gap?.ok ? gap.region.map((poly) => poly.map((ring) => ring.map(pt))) : null,
      };
    }),
    viewers: scene.viewers.map((v) => ({ name: v.name, at: pt(v.positionM) })),
    mirrors: placements.map((p, i) => ({
      label: p.label,
      at: pt(p.positionM),
      azimuthRad: round3(p.azimuthRad),
      dimensions: dimensions[i],
    })),
    coverage: evaluation.placements.map((ev) => (ev.coverage ? ev.coverage.region.map((poly) => poly.map((ring) => ring.map(pt))) : [])),
    ...underlayOf(scene, input.files),
  };

  const purchase = purchaseLines(placements, input.catalogue, f.money);

  const content: SheetContent = {
    format: 2,
    projectId: input.project.id,
    project: {
      name: input.project.name,
      customer: input.project.customer,
      site: input.project.site,
      kind: input.project.kind,
      notes: input.project.notes.trim(),
    },
    installer: { name: input.owner.name, email: input.owner.email, organization: input.organization },
    units,
    cautions: SHEET_CAUTIONS,
    criteria: {
      detect: criterionText(criteria, 'detect'),
      recognise: criterionText(criteria, 'recognise'),
      basis: criteriaBasisText(criteria),
    },
    zones,
    placements: sheetPlacements,
    plan,
    purchase,
    vehicle: buildVehicleSheet(scene, evaluation, placements, f),
  };
  return { content, evaluation, placements };
}

/** Placements grouped by catalogue item (quantity × unit price), summed per currency; custom mirrors priced on request. */
export function purchaseLines(
  placements: readonly SheetPlacementInput[],
  catalogue: readonly CatalogueItemDto[],
  money: (minor: number, currency: string) => string,
): SheetContent['purchase'] {
  const counts = new Map<number, number>();
  let onRequest = 0;
  for (const p of placements) {
    if (p.customMirror) onRequest += 1;
    else if (p.catalogueItemId != null) counts.set(p.catalogueItemId, (counts.get(p.catalogueItemId) ?? 0) + 1);
  }
  const items = [...counts.entries()]
    .map(([id, quantity]) => ({ item: catalogue.find((c) => c.id === id), quantity }))
    .filter((x): x is { item: CatalogueItemDto; quantity: number } => x.item !== undefined)
    .sort((a, b) => a.item.code.localeCompare(b.item.code, 'en'));
  const totals = new Map<string, number>();
  const lines: SheetPurchaseLine[] = items.map(({ item, quantity }) => {
    const totalMinor = item.unitPriceMinor * quantity;
    totals.set(item.currency, (totals.get(item.currency) ?? 0) + totalMinor);
    return {
      code: item.code,
      description: item.name,
      quantity,
      unitPrice: money(item.unitPriceMinor, item.currency),
      lineTotal: money(totalMinor, item.currency),
      currency: item.currency,
    };
  });
  if (onRequest > 0) {
    lines.push({
      code: 'custom',
      description: 'Custom mirror — price on request',
      quantity: onRequest,
      unitPrice: 'on request',
      lineTotal: 'on request',
      currency: '',
    });
  }
  return {
    lines,
    totals: [...totals.entries()]
      .sort(([a], [b]) => a.localeCompare(b))
      .map(([currency, minor]) => ({ currency, total: money(minor, currency) })),
    onRequest,
  };
}

/** JSON with object keys sorted at every level, so equal content always gives equal text. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

export function contentHash(content: SheetContent): string {
  return createHash('sha256').update(canonicalJson(content)).digest('hex');
}

/** "Cold store aisles and dock (demo)" → "cold-store-aisles-and-dock-demo". */
export function slugOf(name: string): string {
  const slug = name
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60)
    .replace(/-+$/, '');
  return slug || 'project';
}

/** "sightfan-cold-store-rev3-a4.pdf": the paper is in the name, so an A4 and a Letter copy never pass for each other. */
export const sheetFilename = (projectName: string, revision: number, paper: SheetPaper) =>
  `sightfan-${slugOf(projectName)}-rev${revision}-${paper}.pdf`;
