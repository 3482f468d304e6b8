/**
 * E-mail notices of the review loop, through the transactional outbox: they commit with the
 * transition that causes them. Each carries a link to the job on the app's address.
 */
import type { EntityManager } from '@mikro-orm/knex';
import { queueMail } from '../mail/outbox';
import type { Project } from '../projects/project.entity';
import type { User } from '../users/user.entity';

/** A role as the sheet and the e-mails say it. */
export function roleWords(role: string): string {
  if (role === 'reviewer') return 'Safety officer (reviewer)';
  if (role === 'admin') return 'Administrator';
  if (role === 'installer') return 'Installer';
  return role;
}

export const jobLink = (baseUrl: string, project: Project) => `${baseUrl}/projects/${project.id}`;

const footer = '\n\nThis notice was sent by Sightfan. Sign in to answer; replies to this e-mail are not read.';

/** To the named reviewer, or every reviewer of the organisation when none was named. */
export function queueSentNotice(em: EntityManager, project: Project, sender: User, recipients: User[], baseUrl: string): void {
  for (const to of recipients) {
    queueMail(em, {
      organizationId: project.organization.id,
      kind: 'review',
      to: to.email,
      subject: `Job waiting for your review: ${project.name}`,
      text:
        `${sender.name} sent the job "${project.name}" for review${project.reviewer ? ' to you' : ''}.\n\n` +
        `Open it: ${jobLink(baseUrl, project)}` +
        footer,
    });
  }
}

export function queueApprovedNotice(
  em: EntityManager,
  project: Project,
  reviewer: User,
  revision: number,
  hash: string,
  baseUrl: string,
): void {
  queueMail(em, {
    organizationId: project.organization.id,
    kind: 'review',
    to: project.owner.email,
    subject: `Approved: ${project.name}`,
    text:
      `${reviewer.name} (${roleWords(reviewer.role)}) approved revision ${revision} of "${project.name}" (content hash ${hash}).\n\n` +
      `Any change to the job or its mirrors withdraws the approval.\n\nOpen it: ${jobLink(baseUrl, project)}` +
      footer,
  });
}

export function queueReturnedNotice(em: EntityManager, project: Project, reviewer: User, reasons: string[], baseUrl: string): void {
  queueMail(em, {
    organizationId: project.organization.id,
    kind: 'review',
    to: project.owner.email,
    subject: `Returned with reasons: ${project.name}`,
    text:
      `${reviewer.name} (${roleWords(reviewer.role)}) returned "${project.name}" to you. What must change:\n\n` +
      reasons.map((r) => `- ${r}`).join('\n') +
      `\n\nOpen it: ${jobLink(baseUrl, project)}` +
      footer,
  });
}
