import type { MirrorClass } from '../../../shared/schemas';
import { vehicleMirrorProblem } from '../../../shared/project-optics/vehicle';
import { HttpError } from '../../http-error';
import type { Project } from './project.entity';

/**
 * A mirror on a vehicle job: it may name a class and the fields it serves (which must be fields
 * of this vehicle under its rules) and may not hang inside the body. A site's mirror has neither.
 */
export function checkVehiclePlacement(
  project: Project,
  p: { label: string; positionM: [number, number]; heightM: number; mirrorClass: MirrorClass | null; servesFieldIds: string[] | null },
): void {
  const fields: Record<string, string> = {};
  if (project.kind === 'site') {
    if (p.mirrorClass !== null) fields.mirrorClass = 'Only a mirror on a vehicle has a class; leave it empty on a site.';
    if (p.servesFieldIds !== null) fields.servesFieldIds = 'Only a mirror on a vehicle serves ground fields; leave it empty on a site.';
  } else {
    const problem = vehicleMirrorProblem(project.scene, p);
    if (problem) fields[problem.field] = problem.message;
  }
  if (Object.keys(fields).length) throw new HttpError(400, `The mirror has a problem: ${Object.values(fields)[0]}`, fields);
}
