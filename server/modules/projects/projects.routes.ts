import { Router } from 'express';
import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import {
  createPlacementBody,
  createProjectBody,
  sceneKindProblem,
  idParam,
  patchPlacementBody,
  searchRule,
  patchProjectBody,
  type MirrorSpec,
} from '../../../shared/schemas';
import { mirrorOfSpec, mountProblem } from '../../../shared/project-optics';
import { resolveUnits } from '../../../shared/units';
import { mirrorOfModel } from '../catalogue/catalogue.dto';
import { zodText } from '../../../shared/schemas/zod-rules';
import { LIMIT_MESSAGES, SCENE_LIMITS } from '../../../shared/schemas/limits';
import { z } from 'zod';
import { HttpError, notFound } from '../../http-error';
import { requireRole, requireUser } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import type { User } from '../users/user.entity';
import { MirrorModel } from '../catalogue/mirror-model.entity';
import { Placement } from './placement.entity';
import { Project } from './project.entity';
import { assertCanEdit, canEdit, findVisibleProject, readVisibleProject, visibleCatalogue } from './project-access';
import { projectSummaries } from './project-list';
import { toPlacementDto, toProjectDto } from './project.dto';
import { onStaleVersion } from '../../write-conflicts';
import { runCompiled } from '../../compiled-query';
import { requestEm } from '../../middleware/request-context';
import { checkVehiclePlacement } from './vehicle-placement';
import type { SheetWork } from '../../workers/sheet-pool';
import { factChanges, placementFacts, projectChanges, recordEvent } from '../review/audit';
import { afterPlacementWrite, openCommentCount, withdrawalIfChanged } from '../review/review-service';
import { removeObjects, storageKeysOf } from '../files/file-objects';
import type { FileStorage } from '../files/storage';
import { StoredFile } from '../files/stored-file.entity';
import type { Logger } from '../../logger';

// A stale `version` fails in the ORM (optimistic locking); the error middleware answers 409 with these.
onStaleVersion(Project, 'project', async (em, stale) => {
  const project = await em.findOneOrFail(Project, stale.id, { populate: ['owner', 'organization', 'reviewer'] });
  return toProjectDto(
    project,
    await placementsOfProject(em as EntityManager, project),
    true,
    await openCommentCount(em as EntityManager, project.id),
  );
});
onStaleVersion(Placement, 'mirror', async (em, stale) => toPlacementDto(await em.findOneOrFail(Placement, stale.id)));

const listQuery = z.object({
  q: zodText(searchRule).optional(),
  sort: z.enum(['updated', 'name', 'customer'], { message: 'Sort by updated, name or customer.' }).default('updated'),
});

/** The project's mirrors in the order they were added (the SQL kept: server/compiled-query.ts), managed by `em`. */
export async function placementsOfProject(em: EntityManager, project: Project): Promise<Placement[]> {
  const rows = await runCompiled<Record<string, unknown>>(em, 'placements:of-project', { projectId: project.id }, (slot) =>
    em
      .createQueryBuilder(Placement, 'pl')
      .select('pl.*')
      .where({ project: slot('projectId') })
      .orderBy({ id: 'asc' }),
  );
  return rows.map((row) => em.map(Placement, row));
}

/** Placement references must point at things that exist: a catalogue item, a viewer in the plan. */
async function checkReferences(em: EntityManager, project: Project, body: { catalogueItemId?: number | null; viewerId?: string | null }) {
  const fields: Record<string, string> = {};
  if (
    body.catalogueItemId != null &&
    !(await em.count(MirrorModel, { $and: [{ id: body.catalogueItemId }, visibleCatalogue(project.organization.id)] }))
  ) {
    fields.catalogueItemId = 'That catalogue mirror does not exist; pick one from the catalogue.';
  }
  if (body.viewerId != null && !project.scene.viewers.some((v) => v.id === body.viewerId)) {
    fields.viewerId = 'That viewer is not in this plan; add the viewer first or pick another.';
  }
  if (Object.keys(fields).length) throw new HttpError(400, Object.values(fields)[0], fields);
}

/**
 * A mirror may not hang inside a wall or rack of the plan (the shared rule in
 * shared/project-optics/mounting.ts): refused with the sentence the editor also shows.
 */
async function checkMount(
  em: EntityManager,
  user: User,
  project: Project,
  p: {
    label: string;
    catalogueItemId: number | null;
    customMirror: MirrorSpec | null;
    positionM: [number, number];
    heightM: number;
    azimuthRad: number;
    tiltDownRad: number;
    viewerId: string | null;
  },
) {
  let spec = p.customMirror;
  if (!spec && p.catalogueItemId != null) {
    const model = await em.findOne(MirrorModel, { id: p.catalogueItemId });
    spec = model ? mirrorOfModel(model) : null;
  }
  if (!spec) return;
  const problem = mountProblem({
    label: p.label,
    mirror: mirrorOfSpec(spec),
    placement: p,
    scene: project.scene,
    units: resolveUnits(project.units, user.units),
  });
  if (problem) throw new HttpError(400, problem.message, { positionM: problem.message });
}

/** A placement's facts for the audit log, its catalogue item's code loaded. */
async function factsOf(em: EntityManager, p: Placement): Promise<Record<string, string>> {
  if (p.catalogueItem) await em.populate(p, ['catalogueItem']);
  return placementFacts(p);
}

export function projectsRoutes(work: SheetWork, files: { storage: FileStorage; log: Logger }): Router {
  const r = Router();
  /** Uploaded objects go after their rows are committed (server/modules/files/file-objects.ts). */
  const dropObjects = (keys: string[]) =>
    removeObjects(files.storage, keys, (err) => files.log.error('A deleted job’s or mirror’s stored file could not be removed.', err));
  r.use(requireUser);

  r.get('/', async (req, res) => {
    const q = parseOr400(listQuery, req.query, 'The search');
    res.json({ projects: await projectSummaries(requestEm(), req.user!, q.q || undefined, q.sort) });
  });

  r.post('/', requireRole('installer'), async (req, res) => {
    const body = parseOr400(createProjectBody, req.body, 'The project');
    const em = requestEm();
    const project = await em.transactional(async (tx) => {
      const created = tx.create(Project, { ...body, owner: req.user!.id, organization: req.user!.organization.id });
      await tx.flush();
      recordEvent(tx, { projectId: created.id, kind: 'created', actor: req.user!, summary: `Created "${created.name}".` });
      return created;
    });
    await em.populate(project, ['owner']);
    res.status(201).json({ project: toProjectDto(project, [], true) });
  });

  r.get('/:id', async (req, res) => {
    const em = requestEm();
    // The answer names the owner and reviewer; the organisation is needed only as its id.
    const project = await readVisibleProject(em, req.user!, req.params.id);
    res.json({
      project: toProjectDto(
        project,
        await placementsOfProject(em, project),
        canEdit(req.user!, project),
        await openCommentCount(em, project.id),
      ),
    });
  });

  r.patch('/:id', async (req, res) => {
    const em = requestEm();
    await em.begin();
    try {
      const project = await patchProject(em, req.user!, req.params.id, req.body);
      await em.commit();
      res.json({ project: toProjectDto(project, await placementsOfProject(em, project), true, await openCommentCount(em, project.id)) });
    } catch (e) {
      // A failed commit has already rolled back (PostgreSQL reports it so); roll back only what is open.
      if (em.isInTransaction()) await em.rollback();
      throw e;
    }
  });

  /** The job's fields and plan; in the caller's transaction with its `changed` event and the withdrawal rule. */
  async function patchProject(em: EntityManager, user: User, rawId: unknown, rawBody: unknown): Promise<Project> {
    const project = await findVisibleProject(em, user, rawId);
    assertCanEdit(user, project);
    const body = parseOr400(patchProjectBody, rawBody, 'The change');
    await em.lock(project, LockMode.OPTIMISTIC, body.version);
    const { version: _v, kind: _k, ...changes } = body;
    const before = { name: project.name, customer: project.customer, site: project.site, notes: project.notes, scene: project.scene };
    if (changes.scene) {
      const problem = sceneKindProblem(project.kind, changes.scene);
      if (problem) throw new HttpError(400, `The change has a problem: ${problem.message}`, { [problem.path.join('.')]: problem.message });
      // The underlay must be one of this job's uploaded plans (checked when it changes, so a plan
      // deleted later does not block other edits; the sheet then draws without it).
      const fileId = changes.scene.underlay?.fileId;
      if (
        fileId &&
        fileId !== project.scene.underlay?.fileId &&
        !(await em.count(StoredFile, { id: fileId, project: project.id, kind: 'plan' }))
      ) {
        const sentence = 'Choose one of this job’s uploaded plans for the underlay.';
        throw new HttpError(400, `The change has a problem: ${sentence}`, { 'scene.underlay.fileId': sentence });
      }
      // A viewer still served by a mirror cannot vanish from the plan.
      const ids = new Set(changes.scene.viewers.map((v) => v.id));
      const orphan = (await placementsOfProject(em, project)).find((p) => p.viewerId && !ids.has(p.viewerId));
      if (orphan)
        throw new HttpError(409, `Mirror "${orphan.label}" serves a viewer this change removes; move it to another viewer first.`, {
          scene: 'A viewer in use was removed.',
        });
    }
    em.assign(project, changes);
    const changed = projectChanges(before, project);
    if (changed.length)
      recordEvent(em, {
        projectId: project.id,
        kind: 'changed',
        actor: user,
        summary: `Changed ${changed.map((c) => c.field).join(', ')}.`,
        changes: changed,
      });
    const withdrawn = await withdrawalIfChanged(em, project, user, work);
    if (withdrawn) em.assign(project, withdrawn);
    await em.flush();
    return project;
  }

  r.delete('/:id', async (req, res) => {
    const em = requestEm();
    const project = await findVisibleProject(em, req.user!, req.params.id);
    assertCanEdit(req.user!, project);
    // The job's uploads go with it: rows here, objects once this has committed.
    const keys = await storageKeysOf(em, { project: project.id });
    await em.nativeDelete(StoredFile, { project: project.id });
    await em.nativeDelete(Placement, { project: project.id });
    em.remove(project);
    await em.flush();
    await dropObjects(keys);
    res.status(204).end();
  });

  r.post('/:id/placements', async (req, res) => {
    const out = await requestEm().transactional(async (em) => {
      const project = await findVisibleProject(em, req.user!, req.params.id);
      assertCanEdit(req.user!, project);
      const body = parseOr400(createPlacementBody, req.body, 'The mirror');
      // The mirror limit bounds the sheet's work (SCENE_LIMITS); counted before the body's references.
      if ((await em.count(Placement, { project: project.id })) >= SCENE_LIMITS.mirrors) throw new HttpError(409, LIMIT_MESSAGES.mirrors);
      await checkReferences(em, project, body);
      await checkMount(em, req.user!, project, body);
      checkVehiclePlacement(project, body);
      const { positionM, catalogueItemId, ...rest } = body;
      const placement = em.create(Placement, {
        ...rest,
        project,
        catalogueItem: catalogueItemId,
        xM: positionM[0],
        yM: positionM[1],
      });
      await em.flush();
      const after = await factsOf(em, placement);
      recordEvent(em, {
        projectId: project.id,
        kind: 'placement_added',
        actor: req.user!,
        summary: `Added mirror "${placement.label}".`,
        changes: factChanges({}, after),
        detail: { placementId: placement.id },
      });
      const projectVersion = await afterPlacementWrite(em, project, req.user!, work);
      return { placement: toPlacementDto(placement), projectVersion };
    });
    res.status(201).json(out);
  });

  r.patch('/:id/placements/:placementId', async (req, res) => {
    const out = await requestEm().transactional(async (em) => {
      const project = await findVisibleProject(em, req.user!, req.params.id);
      assertCanEdit(req.user!, project);
      const placementId = parseOr400(idParam, req.params.placementId, 'The address');
      const body = parseOr400(patchPlacementBody, req.body, 'The mirror');
      const placement = await em.findOne(Placement, { id: placementId, project: project.id });
      if (!placement) throw notFound('That mirror');
      await em.lock(placement, LockMode.OPTIMISTIC, body.version);
      const before = await factsOf(em, placement);
      await checkReferences(em, project, body);
      const merged = {
        label: body.label ?? placement.label,
        catalogueItemId:
          body.catalogueItemId !== undefined
            ? body.catalogueItemId
            : body.customMirror != null
              ? null
              : (placement.catalogueItem?.id ?? null),
        customMirror: body.customMirror !== undefined ? body.customMirror : body.catalogueItemId != null ? null : placement.customMirror,
        positionM: body.positionM ?? ([placement.xM, placement.yM] as [number, number]),
        heightM: body.heightM ?? placement.heightM,
        azimuthRad: body.azimuthRad ?? placement.azimuthRad,
        tiltDownRad: body.tiltDownRad ?? placement.tiltDownRad,
        viewerId: body.viewerId !== undefined ? body.viewerId : placement.viewerId,
        mirrorClass: body.mirrorClass !== undefined ? body.mirrorClass : placement.mirrorClass,
        servesFieldIds: body.servesFieldIds !== undefined ? body.servesFieldIds : placement.servesFieldIds,
      };
      await checkMount(em, req.user!, project, merged);
      checkVehiclePlacement(project, merged);
      const { version: _v, positionM, catalogueItemId, ...rest } = body;
      em.assign(placement, rest);
      if (positionM) {
        placement.xM = positionM[0];
        placement.yM = positionM[1];
      }
      if (catalogueItemId !== undefined)
        placement.catalogueItem = catalogueItemId === null ? null : em.getReference(MirrorModel, catalogueItemId);
      if (body.catalogueItemId != null) placement.customMirror = null;
      if (body.customMirror != null) placement.catalogueItem = null;
      await em.flush();
      const changes = factChanges(before, await factsOf(em, placement));
      if (changes.length)
        recordEvent(em, {
          projectId: project.id,
          kind: 'placement_changed',
          actor: req.user!,
          summary: `Changed mirror "${placement.label}": ${changes.map((c) => c.field).join(', ')}.`,
          changes,
          detail: { placementId: placement.id },
        });
      const projectVersion = await afterPlacementWrite(em, project, req.user!, work);
      return { placement: toPlacementDto(placement), projectVersion };
    });
    res.json(out);
  });

  r.delete('/:id/placements/:placementId', async (req, res) => {
    let photoKeys: string[] = [];
    const out = await requestEm().transactional(async (em) => {
      const project = await findVisibleProject(em, req.user!, req.params.id);
      assertCanEdit(req.user!, project);
      const placementId = parseOr400(idParam, req.params.placementId, 'The address');
      const placement = await em.findOne(Placement, { id: placementId, project: project.id });
      if (!placement) throw notFound('That mirror');
      const before = await factsOf(em, placement);
      // Its photos go with it (the rows here; their objects once this has committed).
      photoKeys = await storageKeysOf(em, { placement: placement.id });
      await em.nativeDelete(StoredFile, { placement: placement.id });
      em.remove(placement);
      await em.flush();
      recordEvent(em, {
        projectId: project.id,
        kind: 'placement_removed',
        actor: req.user!,
        summary: `Removed mirror "${placement.label}".`,
        changes: factChanges(before, Object.fromEntries(Object.keys(before).map((k) => [k, '']))),
        detail: { placementId },
      });
      return { projectVersion: await afterPlacementWrite(em, project, req.user!, work) };
    });
    await dropObjects(photoKeys);
    res.json(out);
  });

  return r;
}
