import { defineEntity, type Opt } from '@mikro-orm/core';
import type { UnitSystem } from '../../../shared/schemas';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

/**
 * One issued revision of a project's specification sheet. A new row is written only when the
 * sheet's content hash differs from the latest one, so the number rises exactly when content changes.
 * `issuedAt` is whole seconds: the PDF's metadata dates are derived from it, so it must round-trip.
 * `content` is the issued SheetContent as JSON, so a named revision renders the same later, whatever
 * the project has become since (null for revisions issued before it was kept).
 */
export class SheetRevision {
  id!: number;
  project!: Project;
  number!: number;
  contentHash!: string;
  issuedAt!: Date;
  issuedBy!: User;
  content?: string | null;
  /** The units the kept content is printed in (null: issued before this was recorded). */
  units: Opt<UnitSystem> | null = null;

  static readonly schema = defineEntity({
    class: SheetRevision,
    tableName: 'sheet_revision',
    uniques: [{ properties: ['project', 'number'] }],
    properties: (p) => ({
      id: p.integer().primary().autoincrement(),
      project: p.manyToOne(Project.schema).deleteRule('cascade'),
      number: p.integer(),
      contentHash: p.string().length(64),
      issuedAt: p.datetime(),
      issuedBy: p.manyToOne(User.schema),
      content: p.text().nullable().lazy(true, false),
      units: p.enum(['metric', 'imperial']).nullable(),
    }),
  });
}
