import { defineEntity, type Opt } from '@mikro-orm/core';
import { projectKinds, projectStates, type ProjectState, type Scene, type UnitSystem } from '../../../shared/schemas';
import { BaseRecord, baseProperties } from '../base';
import { Organization } from '../users/organization.entity';
import { User } from '../users/user.entity';

/** A job: a site or a vehicle (`scene.vehicle`) with its plan. `version` guards against silent overwrites. */
export class Project extends BaseRecord {
  owner!: User;
  organization!: Organization;
  name!: string;
  customer: Opt<string> = '';
  site: Opt<string> = '';
  kind: Opt<(typeof projectKinds)[number]> = 'site';
  units: Opt<UnitSystem> | null = null;
  notes: Opt<string> = '';
  /** The review state (shared/schemas/review.ts); changed only by the review service. */
  state: Opt<ProjectState> = 'drawing_up';
  /** The reviewer a job was sent to, if one was named. */
  reviewer: Opt<User> | null = null;
  sentAt: Opt<Date> | null = null;
  /** The approval, kept as it was given (name and role as they were then). */
  approvedBy: Opt<User> | null = null;
  approvedByName: Opt<string> | null = null;
  approvedByRole: Opt<string> | null = null;
  approvedAt: Opt<Date> | null = null;
  approvedRevision: Opt<number> | null = null;
  approvedHash: Opt<string> | null = null;
  scene: Opt<Scene> = { walls: [], zones: [], viewers: [] };
  version: Opt<number> = 1;
  demo: Opt<boolean> = false;

  static readonly schema = defineEntity({
    class: Project,
    tableName: 'project',
    // The list of a reviewer or admin: one organisation's jobs, most recently changed first.
    indexes: [{ properties: ['organization', 'updatedAt'] }],
    properties: (p) => ({
      ...baseProperties(),
      owner: p.manyToOne(User.schema).index(),
      organization: p.manyToOne(Organization.schema).index(),
      name: p.string().length(80),
      customer: p.string().length(160).default(''),
      site: p.string().length(200).default(''),
      kind: p.enum([...projectKinds]).default('site'),
      units: p.enum(['metric', 'imperial']).nullable(),
      notes: p.text().default(''),
      state: p
        .enum([...projectStates])
        .default('drawing_up')
        .index(),
      reviewer: p.manyToOne(User.schema).nullable(),
      sentAt: p.datetime().nullable(),
      approvedBy: p.manyToOne(User.schema).nullable(),
      approvedByName: p.string().length(120).nullable(),
      approvedByRole: p.string().length(40).nullable(),
      approvedAt: p.datetime().nullable(),
      approvedRevision: p.integer().nullable(),
      approvedHash: p.string().length(64).nullable(),
      scene: p.json<Scene>(),
      version: p.integer().version().default(1),
      demo: p.boolean().default(false),
    }),
  });
}
