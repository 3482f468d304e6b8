import { defineEntity, type Opt } from '@mikro-orm/core';
import type { ProjectEventKind } from '../../../shared/schemas';
import { projectEventKinds } from '../../../shared/schemas';

export type EventChange = { field: string; before: string; after: string };
export type EventDetail = Record<string, string | number | null>;

/**
 * One audit event. Append-only: the database refuses UPDATE and DELETE on this table (triggers in
 * Migration20261202160000), and the API has no route that changes one. It keeps plain ids (no
 * foreign keys), so deleting a job or a person never needs to touch the log.
 */
export class ProjectEvent {
  id!: number;
  projectId!: number;
  kind!: ProjectEventKind;
  actorId: Opt<number> | null = null;
  actorName!: string;
  at: Opt<Date> = new Date();
  summary!: string;
  changes: Opt<EventChange[]> = [];
  detail: Opt<EventDetail> = {};

  static readonly schema = defineEntity({
    class: ProjectEvent,
    tableName: 'project_event',
    properties: (p) => ({
      id: p.integer().primary().autoincrement(),
      projectId: p.integer().index(),
      kind: p.enum([...projectEventKinds]),
      actorId: p.integer().nullable(),
      actorName: p.string().length(120),
      at: p.datetime().onCreate(() => new Date()),
      summary: p.text(),
      changes: p.json<EventChange[]>(),
      detail: p.json<EventDetail>(),
    }),
  });
}
