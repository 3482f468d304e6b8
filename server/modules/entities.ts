/**
 * Every entity, in one list, for the ORM config and the migrator.
 * Entities use `defineEntity` with plain classes: decorators need emitted metadata, which tsx and
 * Babel do not produce (see DEVELOPERS.md, Footguns).
 */
import { Organization } from './users/organization.entity';
import { User } from './users/user.entity';
import { Invitation } from './users/invitation.entity';
import { SessionRecord } from './sessions/session.entity';
import { MailMessage } from './mail/mail-message.entity';
import { MirrorModel } from './catalogue/mirror-model.entity';
import { Project } from './projects/project.entity';
import { Placement } from './projects/placement.entity';
import { SheetRevision } from './sheets/sheet-revision.entity';
import { OutgoingMail } from './mail/outgoing-mail.entity';
import { SheetEvaluation } from './sheets/sheet-evaluation.entity';
import { ProjectComment } from './review/comment.entity';
import { ProjectEvent } from './review/project-event.entity';
import { RateCounter } from './limits/rate-counter.entity';
import { StoredFile } from './files/stored-file.entity';

export const entities = [
  Organization.schema,
  User.schema,
  Invitation.schema,
  SessionRecord.schema,
  MailMessage.schema,
  MirrorModel.schema,
  Project.schema,
  Placement.schema,
  SheetRevision.schema,
  OutgoingMail.schema,
  SheetEvaluation.schema,
  ProjectComment.schema,
  ProjectEvent.schema,
  RateCounter.schema,
  StoredFile.schema,
];
