/**
 * Whether e-mailing a sheet needs a second "yes": the sheet is not the approved one and the
 * address looks like it leaves the organisation. The app cannot list the organisation's people
 * (only admins can), so "outside" is read from the address: another domain than the signed-in
 * person's. The server's own rule (not a user of the organisation) decides the hourly limit.
 */
export function domainOf(address: string): string {
  const at = address.trim().lastIndexOf('@');
  return at < 0
    ? ''
    : address
        .trim()
        .slice(at + 1)
        .toLowerCase();
}

export function isOutsideAddress(to: string, ownEmail: string | undefined): boolean {
  const theirs = domainOf(to);
  const ours = ownEmail ? domainOf(ownEmail) : '';
  return !ours || theirs !== ours;
}

export function needsSendConfirmation(to: string, ownEmail: string | undefined, approved: boolean | undefined): boolean {
  return approved !== true && isOutsideAddress(to, ownEmail);
}

/** The warning shown before sending an unapproved sheet outside; the button under it sends anyway. */
export function outsideWarning(to: string): string {
  return `This sheet is not approved, and ${to.trim()} is outside your organisation. Every page will say it is not the approved version. Send it anyway?`;
}
