/**
 * Writes audit events into the caller's unit of work, so each commits with the change it records.
 * Also the before → after lists for the fields that matter.
 */
import type { EntityManager } from '@mikro-orm/knex';
import type { ProjectEventDto, ProjectEventKind, Scene } from '../../../shared/schemas';
import { formatAngle, formatLength } from '../../../shared/units';
import type { Placement } from '../projects/placement.entity';
import type { User } from '../users/user.entity';
import { ProjectEvent, type EventChange, type EventDetail } from './project-event.entity';

export function recordEvent(
  em: EntityManager,
  e: { projectId: number; kind: ProjectEventKind; actor: User | null; summary: string; changes?: EventChange[]; detail?: EventDetail },
): ProjectEvent {
  return em.create(ProjectEvent, {
    projectId: e.projectId,
    kind: e.kind,
    actorId: e.actor?.id ?? null,
    actorName: e.actor?.name ?? 'Sightfan',
    at: new Date(),
    summary: e.summary,
    changes: e.changes ?? [],
    detail: e.detail ?? {},
  });
}

export function toEventDto(e: ProjectEvent): ProjectEventDto {
  return {
    id: e.id,
    projectId: e.projectId,
    kind: e.kind,
    actorId: e.actorId,
    actorName: e.actorName,
    at: e.at.toISOString(),
    summary: e.summary,
    changes: e.changes,
    detail: e.detail,
  };
}

/** Pairs whose values differ, as before → after text. */
export function diff(pairs: [field: string, before: string, after: string][]): EventChange[] {
  return pairs.filter(([, b, a]) => b !== a).map(([field, before, after]) => ({ field, before, after }));
}

export interface ProjectText {
  name: string;
  customer: string;
  site: string;
  notes: string;
  scene: Scene;
}

/** The job's own fields and the plan's counts. Units are a display setting: not recorded. */
export function projectChanges(before: ProjectText, after: ProjectText): EventChange[] {
  return diff([
    ['name', before.name, after.name],
    ['customer', before.customer, after.customer],
    ['site', before.site, after.site],
    ['notes', before.notes, after.notes],
    ['walls', `${before.scene.walls.length}`, `${after.scene.walls.length}`],
    ['zones', `${before.scene.zones.length}`, `${after.scene.zones.length}`],
    ['viewers', `${before.scene.viewers.length}`, `${after.scene.viewers.length}`],
  ]);
}

/** A placement's fields that matter to a reviewer, as text (metric: the log is one record for every reader). */
export function placementFacts(p: Placement): Record<string, string> {
  const m = (v: number) => formatLength(v, 'metric', { kind: 'distance' });
  return {
    label: p.label,
    mirror: p.catalogueItem ? `catalogue item ${p.catalogueItem.id}` : p.customMirror ? `custom ${p.customMirror.shape}` : 'none',
    position: `${m(p.xM)}, ${m(p.yM)}`,
    height: m(p.heightM),
    aim: formatAngle(p.azimuthRad),
    tilt: formatAngle(p.tiltDownRad),
    viewer: p.viewerId ?? 'none',
  };
}

export function factChanges(before: Record<string, string>, after: Record<string, string>): EventChange[] {
  return diff(Object.keys(after).map((k) => [k, before[k] ?? '', after[k]] as [string, string, string]));
}
