/** Where a signed-in person goes when `next` is missing or not ours. */
export const homePath = '/go';

/**
 * A redirect target of our own, or home. `raw` is parsed with the URL API against our origin,
 * the way the browser will resolve it: backslashes count as slashes and tabs and newlines are
 * dropped, so `/\host` and `/<tab>/host` are another host and go home. What comes back is a
 * path (with query and hash) that can only be read as same-origin: it starts with one slash.
 */
export function findSafeNextPath(raw: string | null | undefined, origin: string): string {
  if (typeof raw !== 'string' || !raw.startsWith('/')) return homePath;
  let base: URL;
  let target: URL;
  try {
    base = new URL(origin);
    target = new URL(raw, base);
  } catch {
    return homePath;
  }
  if (target.origin !== base.origin || target.username || target.password) return homePath;
  const path = `${target.pathname}${target.search}${target.hash}`;
  // A normalised path such as //host (from /.//host) would itself be read as another host.
  if (!path.startsWith('/') || path.startsWith('//') || path.includes('\\')) return homePath;
  return path;
}
