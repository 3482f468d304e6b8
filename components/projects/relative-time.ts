/** "2 h ago · 2 Dec 2025": how long ago in words a person scans, and the date for the record. */
export function relativeTime(iso: string, now: Date = new Date()): string {
  const then = new Date(iso);
  const seconds = Math.round((now.getTime() - then.getTime()) / 1000);
  if (!Number.isFinite(seconds)) return '';
  if (seconds < 60) return 'just now';
  const minutes = Math.floor(seconds / 60);
  if (minutes < 60) return `${minutes} min ago`;
  const hours = Math.floor(minutes / 60);
  if (hours < 24) return `${hours} h ago`;
  const days = Math.floor(hours / 24);
  if (days < 30) return `${days} d ago`;
  const months = Math.floor(days / 30.44);
  if (months < 12) return `${months} mo ago`;
  return `${Math.floor(days / 365.25)} y ago`;
}

/** A date that cannot be misread as month/day or day/month: 2 Dec 2025. */
export function shortDate(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '';
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric' }).format(d);
}

export function lastChangeText(iso: string, now?: Date): string {
  return `${relativeTime(iso, now)} · ${shortDate(iso)}`;
}
