/**
 * Whether e-mailing a sheet needs a second "yes": the sheet is not the approved one and the address
 * leaves the organisation. "Leaves" is the server's rule (not a user of the project's organisation),
 * asked through `GET /api/projects/:id/sheet/recipient`, the same rule its hourly limit counts by.
 */
import type { ApiClient } from '@/shared/api-client';

/**
 * Asks the server whether `to` is outside the organisation. When the question cannot be answered
 * (offline, a refusal), the answer is "outside": asking once too often is the safe mistake.
 */
export async function isOutsideOrganisation(client: Pick<ApiClient, 'sheets'>, projectId: number, to: string): Promise<boolean> {
  try {
    return (await client.sheets.recipient(projectId, to)).outsideOrganisation;
  } catch {
    return true;
  }
}

export function needsSendConfirmation(outsideOrganisation: boolean, approved: boolean | undefined): boolean {
  return approved !== true && outsideOrganisation;
}

/** The warning shown before sending an unapproved sheet outside; the button under it sends anyway. */
export function outsideWarning(to: string): string {
  return `This sheet is not approved, and ${to.trim()} is outside your organisation. Every page will say it is not the approved version. Send it anyway?`;
}
