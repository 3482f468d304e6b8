import { defineEntity, type Opt } from '@mikro-orm/core';
import { mirrorClasses, type MirrorClass, type MirrorSpec } from '../../../shared/schemas';
import { BaseRecord, baseProperties } from '../base';
import { MirrorModel } from '../catalogue/mirror-model.entity';
import { Project } from './project.entity';

/**
 * A mirror placed in a project: a catalogue item or a custom mirror, where and how it is mounted.
 * On a vehicle the position is in the vehicle's plan frame (x forward from the front bumper, y left).
 */
export class Placement extends BaseRecord {
  project!: Project;
  label!: string;
  catalogueItem: Opt<MirrorModel> | null = null;
  customMirror: Opt<MirrorSpec> | null = null;
  xM!: number;
  yM!: number;
  heightM!: number;
  azimuthRad!: number;
  tiltDownRad!: number;
  viewerId: Opt<string> | null = null;
  notes: Opt<string> = '';
  /** Vehicle jobs: the class it is fitted as, and the fields it counts toward (null: every field). */
  mirrorClass: Opt<MirrorClass> | null = null;
  servesFieldIds: Opt<string[]> | null = null;
  version: Opt<number> = 1;

  static readonly schema = defineEntity({
    class: Placement,
    tableName: 'placement',
    properties: (p) => ({
      ...baseProperties(),
      // Indexed on both databases (PostgreSQL does not index a foreign key by itself): a job's mirrors, the list's counts.
      project: p.manyToOne(Project.schema).deleteRule('cascade').index(),
      label: p.string().length(80),
      catalogueItem: p.manyToOne(MirrorModel.schema).nullable(),
      customMirror: p.json<MirrorSpec>().nullable(),
      xM: p.float(),
      yM: p.float(),
      heightM: p.float(),
      azimuthRad: p.float(),
      tiltDownRad: p.float(),
      viewerId: p.string().length(40).nullable(),
      notes: p.text().default(''),
      mirrorClass: p.enum([...mirrorClasses]).nullable(),
      servesFieldIds: p.json<string[]>().nullable(),
      version: p.integer().version().default(1),
    }),
  });
}
