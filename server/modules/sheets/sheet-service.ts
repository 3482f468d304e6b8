/**
 * Loads what a sheet needs, gets its content (from the evaluation cache, or worked out on the sheet
 * worker pool), issues revisions and renders them. Only `issueRevision` writes a revision: reading a
 * sheet (its status, a PDF of an issued revision) changes nothing.
 */
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import { PROJECT_STATE_LABELS, type ProjectState, type SheetPaper, type SheetRevisionDto } from '../../../shared/schemas';
import { resolveUnits } from '../../../shared/units';
import { HttpError } from '../../http-error';
import { defaultPaper } from '../../pdf/render-sheet';
import type { SheetApproval } from '../../pdf/approval-mark';
import { sheetFilename, type SheetFilesInput, type SheetInput } from '../../pdf/sheet-model';
import { roleWords } from '../review/notices';
import type { SheetWork } from '../../workers/sheet-pool';
import { toCatalogueItemDto } from '../catalogue/catalogue.dto';
import { MirrorModel } from '../catalogue/mirror-model.entity';
import { Placement } from '../projects/placement.entity';
import { Project } from '../projects/project.entity';
import { visibleCatalogue } from '../projects/project-access';
import { toPlacementDto } from '../projects/project.dto';
import { User } from '../users/user.entity';
import { SheetEvaluation } from './sheet-evaluation.entity';
import { SheetRevision } from './sheet-revision.entity';
import sharp from 'sharp';
import type { SheetImages } from '../../pdf/draw-plan';
import { StoredFile } from '../files/stored-file.entity';
import type { FileStorage } from '../files/storage';

/** Cached evaluations kept; the least recently used beyond this are deleted. */
export const SHEET_CACHE_ROWS = 200;

export interface CurrentSheet {
  project: Project;
  /** The SheetContent as JSON text: only worker threads parse it. */
  contentJson: string;
  /** The content hash: the engineering content only (review/content-hash.ts), not units or paper. */
  hash: string;
}

/** What the sheet is built from: the project, its placements and the catalogue items they use. */
export async function sheetInput(em: EntityManager, project: Project): Promise<SheetInput> {
  const placements = await em.find(Placement, { project: project.id }, { orderBy: { id: 'asc' } });
  const catalogue = (await em.find(MirrorModel, visibleCatalogue(project.organization.id), { orderBy: { id: 'asc' } })).map(
    toCatalogueItemDto,
  );
  // Only the catalogue items placed here: other items' edits must not change this project's key.
  const used = new Set(placements.map((p) => p.catalogueItem?.id).filter((id) => id != null));
  return {
    project: {
      id: project.id,
      name: project.name,
      customer: project.customer,
      site: project.site,
      kind: project.kind,
      notes: project.notes,
      units: project.units,
      scene: project.scene,
    },
    owner: { name: project.owner.name, email: project.owner.email, units: project.owner.units },
    organization: project.organization.name,
    placements: placements.map(toPlacementDto),
    catalogue: catalogue.filter((c) => used.has(c.id)),
    files: await sheetFiles(em, project),
  };
}

/** The plan underlay's file (when the scene names one of this job's plans) and each mirror's newest photo. */
async function sheetFiles(em: EntityManager, project: Project): Promise<SheetFilesInput> {
  const underlayId = project.scene.underlay?.fileId;
  const underlay = underlayId ? await em.findOne(StoredFile, { id: underlayId, project: project.id, kind: 'plan' }) : null;
  const photos = await em.find(
    StoredFile,
    { project: project.id, kind: 'photo', placement: { $ne: null } },
    { orderBy: { createdAt: 'desc', id: 'asc' } },
  );
  const newest = new Map<number, StoredFile>();
  for (const f of photos) if (f.placement && !newest.has(f.placement.id)) newest.set(f.placement.id, f);
  return {
    underlay: underlay ? { fileId: underlay.id, widthPx: underlay.widthPx, heightPx: underlay.heightPx } : null,
    photos: [...newest.entries()]
      .sort((a, b) => a[0] - b[0])
      .map(([placementId, f]) => ({
        placementId,
        fileId: f.id,
        widthPx: f.widthPx,
        heightPx: f.heightPx,
        name: f.name,
        takenOn: f.createdAt.toISOString().slice(0, 10),
      })),
  };
}

/** Longest side of the plan underlay as embedded in a sheet, pixels (about 200 dpi across A4's plan frame). */
const SHEET_UNDERLAY_PX = 2400;

/**
 * The bytes a sheet shows, by file id, read from the storage: the underlay re-encoded as a JPEG of
 * print size (pdfkit embeds a JPEG as it is, but decodes a PNG in JavaScript), each photo's stored
 * thumbnail (a JPEG). A file that cannot be read is left out; the sheet says so where it would be.
 */
export async function sheetImages(em: EntityManager, storage: FileStorage, project: Project): Promise<SheetImages> {
  const files = await sheetFiles(em, project);
  const out: Record<string, Uint8Array> = {};
  const rows = await em.find(StoredFile, {
    id: { $in: [files.underlay?.fileId, ...(files.photos ?? []).map((p) => p.fileId)].filter((id): id is string => !!id) },
  });
  await Promise.all(
    rows.map(async (f) => {
      try {
        if (f.kind === 'plan') {
          out[f.id] = await sharp(await storage.get(f.storageKey))
            .resize({ width: SHEET_UNDERLAY_PX, height: SHEET_UNDERLAY_PX, fit: 'inside', withoutEnlargement: true })
            .flatten({ background: '#ffffff' })
            .jpeg({ quality: 80 })
            .toBuffer();
        } else {
          out[f.id] = await storage.get(f.thumbnailKey);
        }
      } catch {
        // Left out: the sheet prints "could not be read" in its place.
      }
    }),
  );
  return out;
}

/** The project's sheet content as it stands: from the cache when its input was evaluated before. */
export async function currentContent(em: EntityManager, project: Project, work: SheetWork): Promise<CurrentSheet> {
  const input = await sheetInput(em, project);
  const { inputHash: key, contentHash: hash } = await work.hashes(input);
  const hit = await em.fork().findOne(SheetEvaluation, { inputHash: key });
  if (hit) {
    await em.nativeUpdate(SheetEvaluation, { inputHash: key }, { usedAt: new Date() });
    return { project, contentJson: hit.content, hash };
  }
  const built = await work.build(input);
  await storeEvaluation(em, key, built.contentJson, hash);
  return { project, contentJson: built.contentJson, hash };
}

/** The project's content hash as it stands (no evaluation; hashed on the worker pool). */
export async function currentHash(em: EntityManager, project: Project, work: SheetWork): Promise<string> {
  return work.contentHash(await sheetInput(em, project));
}

/**
 * What a revision's sheet says about approval: the approval when the job is approved and this
 * revision holds the approved content; otherwise the reason it is not the approved version.
 */
export function approvalFor(project: Project, revision: { number: number; contentHash: string }): SheetApproval {
  if (project.state === 'approved' && project.approvedHash && project.approvedAt && project.approvedRevision != null) {
    if (project.approvedHash === revision.contentHash) {
      return {
        approved: true,
        reviewerName: project.approvedByName ?? '',
        reviewerRole: roleWords(project.approvedByRole ?? ''),
        approvedAt: project.approvedAt.toISOString(),
        revision: project.approvedRevision,
        contentHash: project.approvedHash,
      };
    }
    return {
      approved: false,
      reason: `revision ${revision.number} differs from the approved revision ${project.approvedRevision} (hash ${project.approvedHash.slice(0, 12)}). Do not install from it.`,
    };
  }
  return {
    approved: false,
    reason: `no safety officer has approved this job (${PROJECT_STATE_LABELS[project.state as ProjectState].toLowerCase()}). Do not install from it.`,
  };
}

async function storeEvaluation(em: EntityManager, key: string, contentJson: string, hash: string): Promise<void> {
  const fork = em.fork();
  try {
    await fork.insert(SheetEvaluation, { inputHash: key, content: contentJson, contentHash: hash, usedAt: new Date() });
  } catch (e) {
    // Another request evaluated the same input at the same time: its row is as good as ours.
    if (!(e instanceof UniqueConstraintViolationException)) throw e;
    return;
  }
  const stale = await fork.find(
    SheetEvaluation,
    {},
    { fields: ['inputHash'], orderBy: { usedAt: 'desc' }, offset: SHEET_CACHE_ROWS, limit: 1000 },
  );
  if (stale.length) await fork.nativeDelete(SheetEvaluation, { inputHash: { $in: stale.map((s) => s.inputHash) } });
}

/** Empties the evaluation cache (at start-up, so a new engine never serves an old engine's numbers). */
export async function clearEvaluationCache(em: EntityManager): Promise<void> {
  await em.fork().nativeDelete(SheetEvaluation, {});
}

export const latestRevision = (em: EntityManager, project: Project) =>
  em.findOne(SheetRevision, { project: project.id }, { orderBy: { number: 'desc' }, populate: ['issuedBy'] });

/** The latest revision if its content is the current content; otherwise a new revision n + 1. */
export async function issueRevision(
  em: EntityManager,
  sheet: CurrentSheet,
  user: User,
): Promise<{ revision: SheetRevision; created: boolean }> {
  for (let attempt = 0; attempt < 3; attempt++) {
    const latest = await latestRevision(em, sheet.project);
    if (latest && latest.contentHash === sheet.hash) return { revision: latest, created: false };
    // Whole seconds: the PDF's dates are derived from this value and must read back the same.
    const issuedAt = new Date(Math.floor(Date.now() / 1000) * 1000);
    const rev = em.create(SheetRevision, {
      project: em.getReference(Project, sheet.project.id),
      number: (latest?.number ?? 0) + 1,
      contentHash: sheet.hash,
      issuedAt,
      issuedBy: em.getReference(User, user.id),
      content: sheet.contentJson,
      units: resolveUnits(sheet.project.units, sheet.project.owner.units),
    });
    try {
      await em.flush();
      await em.populate(rev, ['issuedBy']);
      return { revision: rev, created: true };
    } catch (e) {
      // Two requests raced for the same number: the other one won; read it and compare again.
      if (!(e instanceof UniqueConstraintViolationException)) throw e;
      em.clear();
    }
  }
  throw new HttpError(503, 'The sheet is being issued by another request right now. Try again in a moment.');
}

export interface RenderedSheet {
  revision: SheetRevision;
  pdf: Buffer;
  paper: SheetPaper;
  filename: string;
  projectName: string;
}

/**
 * The PDF of an issued revision, from the content kept with it. A revision issued before content was
 * kept renders only while the project still has that content. `current`: the content the caller has
 * just worked out (issuing does), used when it is the revision's, so nothing is read or evaluated twice.
 */
export async function renderRevision(
  em: EntityManager,
  project: Project,
  revision: SheetRevision,
  work: SheetWork,
  paper?: SheetPaper,
  current?: CurrentSheet,
  /** Where uploads are kept: the sheet shows the plan underlay and photos (unset: drawn without them). */
  storage?: FileStorage,
): Promise<RenderedSheet> {
  let contentJson: string;
  // The caller's freshly built current content, when this revision holds it: nothing more to read.
  // Otherwise the revision that holds the current engineering content prints as the job stands now
  // (its units): switching units is not a new revision, and its sheet follows the switch.
  const unitsNow = resolveUnits(project.units, project.owner.units);
  let now: CurrentSheet | null = current && current.hash === revision.contentHash ? current : null;
  if (!now) {
    await em.populate(revision, ['content']);
    now =
      (!revision.content || (revision.units !== null && revision.units !== unitsNow)) &&
      (await currentHash(em, project, work)) === revision.contentHash
        ? await currentContent(em, project, work)
        : null;
  }
  if (now) {
    contentJson = now.contentJson;
  } else if (revision.content) {
    contentJson = revision.content;
  } else {
    throw new HttpError(
      410,
      `Revision ${revision.number} was issued before Sightfan kept each revision's content, and the project has changed since, so it cannot be printed again. Issue a new revision.`,
    );
  }
  const out = await work.render(
    contentJson,
    { number: revision.number, contentHash: revision.contentHash, issuedAt: revision.issuedAt },
    paper,
    approvalFor(project, revision),
    storage ? await sheetImages(em, storage, project) : undefined,
  );
  return {
    revision,
    pdf: out.pdf,
    paper: out.paper,
    filename: sheetFilename(project.name, revision.number, out.paper),
    projectName: project.name,
  };
}

/** The paper a sheet of the project's current content prints on by default (its units: imperial → US Letter). */
export const currentPaper = (project: Project): SheetPaper => defaultPaper(resolveUnits(project.units, project.owner.units));

export function toRevisionDto(r: SheetRevision): SheetRevisionDto {
  return { number: r.number, contentHash: r.contentHash, issuedAt: r.issuedAt.toISOString(), issuedBy: r.issuedBy.name };
}
