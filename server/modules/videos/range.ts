// Reading an HTTP Range header for one byte range, so the browser's video element can seek.

export type RangeResult = { start: number; end: number } | 'unsatisfiable' | null;

/**
 * The single byte range asked for (end inclusive, clipped to the size), null for no or an unreadable
 * header (answer with the whole body), or 'unsatisfiable' when it starts past the end. Several ranges
 * at once are answered with the first only, as browsers ask for one at a time.
 */
export function parseRange(header: string | undefined, size: number): RangeResult {
  if (!header) return null;
  const m = /^bytes=(\d*)-(\d*)(?:,.*)?$/.exec(header.trim());
  if (!m || (m[1] === '' && m[2] === '')) return null;
  if (size === 0) return 'unsatisfiable';
  if (m[1] === '') {
    const suffix = Number(m[2]);
    if (suffix === 0) return 'unsatisfiable';
    return { start: Math.max(0, size - suffix), end: size - 1 };
  }
  const start = Number(m[1]);
  const end = m[2] === '' ? size - 1 : Math.min(Number(m[2]), size - 1);
  if (start >= size) return 'unsatisfiable';
  if (end < start) return null;
  return { start, end };
}
