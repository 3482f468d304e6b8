import { defineEntity, type Opt } from '@mikro-orm/core';
import { fileKinds, type FileKind } from '../../../shared/schemas';
import { Placement } from '../projects/placement.entity';
import { Project } from '../projects/project.entity';
import { User } from '../users/user.entity';

/**
 * An uploaded plan or photo of a job. The bytes live in the storage backend under `storageKey`
 * (and the thumbnail under `thumbnailKey`), random names that say nothing of the job or the file;
 * this row is what the API knows about them. The id is random and unguessable, but the routes still
 * check the job's access rules on every read.
 */
export class StoredFile {
  id!: string;
  project!: Project;
  kind!: FileKind;
  /** The stored file's type: images are re-encoded, a PDF plan is kept as a PNG of its page. */
  contentType!: 'image/png' | 'image/jpeg';
  /** The stored file's size in bytes (the thumbnail not counted). */
  bytes!: number;
  /** The name it was uploaded with, cleaned for display. */
  name!: string;
  widthPx!: number;
  heightPx!: number;
  /** The mirror a photo shows; deleting the mirror deletes its photos. */
  placement: Opt<Placement> | null = null;
  /** For a plan taken from a PDF: the page used and the PDF's page count. */
  sourcePage: Opt<number> | null = null;
  sourcePages: Opt<number> | null = null;
  storageKey!: string;
  thumbnailKey!: string;
  createdAt: Opt<Date> = new Date();
  createdBy: Opt<User> | null = null;

  static readonly schema = defineEntity({
    class: StoredFile,
    tableName: 'stored_file',
    properties: (p) => ({
      id: p.string().length(32).primary(),
      project: p.manyToOne(Project.schema).deleteRule('cascade'),
      kind: p.enum([...fileKinds]),
      contentType: p.string().length(40),
      bytes: p.integer(),
      name: p.string().length(200),
      widthPx: p.integer(),
      heightPx: p.integer(),
      placement: p.manyToOne(Placement.schema).nullable().deleteRule('cascade'),
      sourcePage: p.integer().nullable(),
      sourcePages: p.integer().nullable(),
      storageKey: p.string().length(100),
      thumbnailKey: p.string().length(100),
      createdAt: p.datetime().onCreate(() => new Date()),
      createdBy: p.manyToOne(User.schema).nullable().deleteRule('set null'),
    }),
  });
}
