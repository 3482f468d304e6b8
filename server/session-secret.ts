import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';

/**
 * The demo's session secret: generated once and kept beside the database (mode 0600), so sessions
 * survive restarts without anyone having to set SESSION_SECRET. Production must set it.
 */
export function demoSessionSecret(databasePath: string): string {
  const file = path.join(path.dirname(databasePath), 'session-secret');
  try {
    const existing = fs.readFileSync(file, 'utf8').trim();
    if (existing.length >= 32) return existing;
  } catch {
    // not there yet
  }
  const secret = crypto.randomBytes(48).toString('base64url');
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}
