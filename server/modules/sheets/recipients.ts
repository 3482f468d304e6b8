/**
 * Who a sheet goes to: inside the organisation (one of its users) or outside. One rule for the
 * hourly limit on outside e-mails and for the form's question before an unapproved sheet leaves.
 */
import type { EntityManager } from '@mikro-orm/core';
import { ProjectEvent } from '../review/project-event.entity';
import { User } from '../users/user.entity';

/** True when `address` is not the e-mail of a user of the organisation (addresses are stored lower-case). */
export async function isOutsideOrganisation(em: EntityManager, organizationId: number, address: string): Promise<boolean> {
  return (await em.count(User, { email: address.trim().toLowerCase(), organization: organizationId })) === 0;
}

/**
 * How many sheets `userId` e-mailed outside the organisation since `since`, read from the audit log
 * (each `sheet_emailed` event records `outside` in its detail). Written through the ORM's query
 * language, which turns the JSON path into the database's own function.
 */
export async function outsideSheetsSince(em: EntityManager, userId: number, since: Date): Promise<number> {
  return em.count(ProjectEvent, { kind: 'sheet_emailed', actorId: userId, at: { $gt: since }, detail: { outside: 1 } });
}
