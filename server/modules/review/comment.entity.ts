import { defineEntity, type Opt } from '@mikro-orm/core';
import type { CommentPin } from '../../../shared/schemas';
import { BaseRecord, baseProperties } from '../base';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

/** A comment on a job: a thread (no parent) or a reply one level deep. The body is stored as typed. */
export class ProjectComment extends BaseRecord {
  project!: Project;
  parent: Opt<ProjectComment> | null = null;
  author!: User;
  body!: string;
  pin: Opt<CommentPin> = { kind: 'job' };
  isReturnReason: Opt<boolean> = false;
  resolved: Opt<boolean> = false;

  static readonly schema = defineEntity({
    class: ProjectComment,
    tableName: 'project_comment',
    properties: (p) => ({
      ...baseProperties(),
      project: p.manyToOne(Project.schema).deleteRule('cascade').index(),
      parent: p.manyToOne(ProjectComment).nullable().deleteRule('cascade'),
      author: p.manyToOne(User.schema),
      body: p.text(),
      pin: p.json<CommentPin>(),
      isReturnReason: p.boolean().default(false),
      resolved: p.boolean().default(false),
    }),
  });
}
