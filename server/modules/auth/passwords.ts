import bcrypt from 'bcryptjs';

/**
 * bcrypt at cost 12 or more. A sign-in for an unknown address still runs one comparison against
 * this fixed hash, so response time does not tell which addresses have accounts.
 */
let dummyHash: Promise<string> | undefined;
const getDummyHash = () => (dummyHash ??= bcrypt.hash('no account has this password', 12));

export const hashPassword = (password: string, cost: number) => bcrypt.hash(password, cost);

export async function verifyPassword(password: string, hash: string | null | undefined): Promise<boolean> {
  if (!hash) {
    await bcrypt.compare(password, await getDummyHash());
    return false;
  }
  return bcrypt.compare(password, hash);
}
