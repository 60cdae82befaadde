const pad = (value: number) => String(value).padStart(2, '0');

/**
 * A length of time as an operator reads it at a glance: "45 s", "3 min 05 s", "1 h 04 min",
 * "2 d 3 h". Seconds are shown only under an hour, where they still matter for handling.
 */
export function formatDuration(totalSeconds: number): string {
  const seconds = Math.max(0, Math.floor(totalSeconds));
  if (seconds < 60) return `${seconds} s`;
  const minutes = Math.floor(seconds / 60);
  if (minutes < 60) return `${minutes} min ${pad(seconds % 60)} s`;
  const hours = Math.floor(minutes / 60);
  if (hours < 24) return `${hours} h ${pad(minutes % 60)} min`;
  return `${Math.floor(hours / 24)} d ${hours % 24} h`;
}

/** Time since an ISO timestamp, in the same words; a timestamp in the future counts as now. */
export function formatElapsedSince(isoTimestamp: string, now: number): string {
  const started = new Date(isoTimestamp).getTime();
  if (Number.isNaN(started)) return '';
  return formatDuration((now - started) / 1000);
}

/** A looser form for people who are not watching a queue: "just now", "12 minutes ago". */
export function formatTimeAgo(isoTimestamp: string, now: number): string {
  const started = new Date(isoTimestamp).getTime();
  if (Number.isNaN(started)) return '';
  const minutes = Math.floor(Math.max(0, now - started) / 60_000);
  if (minutes < 1) return 'just now';
  if (minutes < 60) return `${minutes} ${minutes === 1 ? 'minute' : 'minutes'} ago`;
  const hours = Math.floor(minutes / 60);
  if (hours < 48) return `${hours} ${hours === 1 ? 'hour' : 'hours'} ago`;
  return `${Math.floor(hours / 24)} days ago`;
}
