/**
 * Loads what a sheet needs, computes its content and hash, and issues revisions: a new revision
 * only when the content hash differs from the latest one.
 */
import { UniqueConstraintViolationException } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/sqlite';
import type { SheetPaper, SheetRevisionDto } from '../../../shared/schemas';
import { HttpError } from '../../http-error';
import { buildSheetContent, contentHash, sheetFilename, type BuiltSheet } from '../../pdf/sheet-model';
import { defaultPaper, renderSheet } from '../../pdf/render-sheet';
import { toCatalogueItemDto } from '../catalog/catalog.dto';
import { MirrorModel } from '../catalog/mirror-model.entity';
import { Placement } from '../projects/placement.entity';
import { Project } from '../projects/project.entity';
import { findVisibleProject, visibleCatalogue } from '../projects/project-access';
import { toPlacementDto } from '../projects/project.dto';
import { User } from '../users/user.entity';
import { SheetRevision } from './sheet-revision.entity';

export interface CurrentSheet {
  project: Project;
  built: BuiltSheet;
  hash: string;
}

export async function loadCurrentSheet(em: EntityManager, user: User, rawId: unknown): Promise<CurrentSheet> {
  const project = await findVisibleProject(em, user, rawId);
  const placements = await em.find(Placement, { project: project.id }, { orderBy: { id: 'asc' } });
  const catalogue = (await em.find(MirrorModel, visibleCatalogue(project.organization.id), { orderBy: { id: 'asc' } })).map(toCatalogueItemDto);
  const built = buildSheetContent({
    project: { id: project.id, name: project.name, customer: project.customer, site: project.site, kind: project.kind, notes: project.notes, units: project.units, scene: project.scene },
    owner: { name: project.owner.name, email: project.owner.email, units: project.owner.units },
    organization: project.organization.name,
    placements: placements.map(toPlacementDto),
    catalogue,
  });
  return { project, built, hash: contentHash(built.content) };
}

export const latestRevision = (em: EntityManager, project: Project) =>
  em.findOne(SheetRevision, { project: project.id }, { orderBy: { number: 'desc' }, populate: ['issuedBy'] });

/** The latest revision if its content is the current content; otherwise a new revision n + 1. */
export async function issueRevision(em: EntityManager, sheet: CurrentSheet, user: User): Promise<SheetRevision> {
  for (let attempt = 0; attempt < 3; attempt++) {
    const latest = await latestRevision(em, sheet.project);
    if (latest && latest.contentHash === sheet.hash) return latest;
    // Whole seconds: the PDF's dates are derived from this value and must read back the same.
    const issuedAt = new Date(Math.floor(Date.now() / 1000) * 1000);
    const rev = em.create(SheetRevision, {
      project: em.getReference(Project, sheet.project.id),
      number: (latest?.number ?? 0) + 1,
      contentHash: sheet.hash,
      issuedAt,
      issuedBy: em.getReference(User, user.id),
    });
    try {
      await em.flush();
      await em.populate(rev, ['issuedBy']);
      return rev;
    } catch (e) {
      // Two renders raced for the same number: the other one won; read it and compare again.
      if (!(e instanceof UniqueConstraintViolationException)) throw e;
      em.clear();
    }
  }
  throw new HttpError(503, 'The sheet is being issued by another request right now. Try again in a moment.');
}

export interface RenderedSheet {
  revision: SheetRevision;
  pdf: Buffer;
  filename: string;
  projectName: string;
}

export async function issueAndRender(em: EntityManager, user: User, rawId: unknown, paper?: SheetPaper): Promise<RenderedSheet> {
  const sheet = await loadCurrentSheet(em, user, rawId);
  const revision = await issueRevision(em, sheet, user);
  const pdf = await renderSheet(sheet.built.content, { number: revision.number, contentHash: revision.contentHash, issuedAt: revision.issuedAt }, paper ?? defaultPaper(sheet.built.content.units));
  return { revision, pdf, filename: sheetFilename(sheet.project.name, revision.number), projectName: sheet.project.name };
}

export function toRevisionDto(r: SheetRevision): SheetRevisionDto {
  return { number: r.number, contentHash: r.contentHash, issuedAt: r.issuedAt.toISOString(), issuedBy: r.issuedBy.name };
}
