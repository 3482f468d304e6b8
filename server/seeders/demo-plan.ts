/**
 * Gives the demo cold store its fictional plan image (demo-plan-image.ts) as a calibrated underlay,
 * stored the way an upload is: sniffed from its bytes, re-encoded with a thumbnail
 * (`processImage`), written to the storage and recorded as a `StoredFile` (`storeProcessedFile`).
 */
import type { EntityManager } from '@mikro-orm/knex';
import type { Orm } from '../db';
import { processImage, sniff } from '../modules/files/process-upload';
import { storeProcessedFile } from '../modules/files/store-file';
import type { FileStorage } from '../modules/files/storage';
import { StoredFile } from '../modules/files/stored-file.entity';
import { Project } from '../modules/projects/project.entity';
import { demoPlanPng, drawDemoPlan } from './demo-plan-image';
import { DEMO_PROJECT } from './demo-project';

/** The name the demo plan is stored under (shown in the job's files). */
export const DEMO_PLAN_FILE_NAME = 'demo plan (fictional).png';

/**
 * Adds the plan to this demo job unless it already has an underlay or a plan file; true when added.
 * Errors (the storage unreachable) are the caller's: the seed fails loudly rather than half-made.
 */
export async function addDemoPlan(em: EntityManager, storage: FileStorage, project: Project): Promise<boolean> {
  if (project.scene.underlay || (await em.count(StoredFile, { project: project.id, kind: 'plan' }))) return false;
  const drawing = drawDemoPlan(project.scene, `${project.customer} · ${project.site}`);
  const png = await demoPlanPng(drawing);
  const type = await sniff(png);
  if (type !== 'image/png') throw new Error('The demo plan did not render as a PNG.');
  const processed = await processImage(png, type);
  const file = await storeProcessedFile(
    em,
    storage,
    { projectId: project.id, kind: 'plan', processed, name: DEMO_PLAN_FILE_NAME, placementId: null, createdBy: project.owner.id },
    () => undefined,
  );
  project.scene = { ...project.scene, underlay: { fileId: file.id, ...drawing.underlay } };
  await em.flush();
  return true;
}

/** The demo cold store (the demo job with walls) gets its plan image once; true when it was added now. */
export async function seedDemoPlan(orm: Orm, storage: FileStorage): Promise<boolean> {
  const em = orm.em.fork();
  const project = await em.findOne(Project, { demo: true, name: DEMO_PROJECT.name, kind: 'site' });
  return project ? addDemoPlan(em, storage, project) : false;
}
