import { defineEntity, type Opt } from '@mikro-orm/core';
import { projectKinds, projectStatuses, type Scene, type UnitSystem } from '../../../shared/schemas';
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
  status: Opt<(typeof projectStatuses)[number]> = 'draft';
  scene: Opt<Scene> = { walls: [], zones: [], viewers: [] };
  version: Opt<number> = 1;
  demo: Opt<boolean> = false;

  static readonly schema = defineEntity({
    class: Project,
    tableName: 'project',
    properties: (p) => ({
      ...baseProperties(),
      owner: p.manyToOne(User.schema),
      organization: p.manyToOne(Organization.schema),
      name: p.string().length(80),
      customer: p.string().length(160).default(''),
      site: p.string().length(200).default(''),
      kind: p.enum([...projectKinds]).default('site'),
      units: p.enum(['metric', 'imperial']).nullable(),
      notes: p.text().default(''),
      status: p.enum([...projectStatuses]).default('draft'),
      scene: p.json<Scene>(),
      version: p.integer().version().default(1),
      demo: p.boolean().default(false),
    }),
  });
}
