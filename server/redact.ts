/** Masking for anything that may be written to a log. */
// No "/" in the class: a path such as /api/projects/1/sheet/revisions is not a token.
const TOKEN_LIKE = /[A-Za-z0-9_%+=-]{24,}/g;
const BCRYPT = /\$2[aby]\$\d\d\$[./A-Za-z0-9]{53}/g;
const SQL = /\b(select|insert|update|delete|pragma|create|alter|drop)\b[\s\S]*\b(from|into|set|table|where|values)\b/i;

/** Masks secrets a message may carry: bcrypt hashes, session ids and tokens, and whole SQL statements. */
export function redact(text: string): string {
  if (SQL.test(text)) return '[SQL statement withheld]';
  return text.replace(BCRYPT, '[hash]').replace(TOKEN_LIKE, '[redacted]');
}
