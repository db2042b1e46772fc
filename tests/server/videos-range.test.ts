// Byte ranges for video playback (the Range header as HTTP semantics define it, RFC 9110 §14).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseRange } from '../../server/modules/videos/range';

describe('parseRange', () => {
  it('reads the forms a player sends', () => {
    expect(parseRange('bytes=0-', 1000)).toEqual({ start: 0, end: 999 });
    expect(parseRange('bytes=100-199', 1000)).toEqual({ start: 100, end: 199 });
    expect(parseRange('bytes=900-5000', 1000)).toEqual({ start: 900, end: 999 }); // clipped to the size
    expect(parseRange('bytes=-100', 1000)).toEqual({ start: 900, end: 999 }); // the last 100 bytes
    expect(parseRange('bytes=0-9, 20-29', 1000)).toEqual({ start: 0, end: 9 }); // first of several
  });

  it('ignores what it cannot read and refuses what starts past the end', () => {
    expect(parseRange(undefined, 1000)).toBeNull();
    expect(parseRange('items=0-5', 1000)).toBeNull();
    expect(parseRange('bytes=-', 1000)).toBeNull();
    expect(parseRange('bytes=9-3', 1000)).toBeNull();
    expect(parseRange('bytes=1000-', 1000)).toBe('unsatisfiable');
    expect(parseRange('bytes=-0', 1000)).toBe('unsatisfiable');
  });

  it('any range it returns lies inside the object', () => {
    fc.assert(
      fc.property(fc.nat(10_000), fc.nat(20_000), fc.nat(20_000), (size, a, b) => {
        const r = parseRange(`bytes=${a}-${b}`, size + 1);
        if (r && r !== 'unsatisfiable') {
          expect(r.start).toBeGreaterThanOrEqual(0);
          expect(r.end).toBeLessThanOrEqual(size);
          expect(r.start).toBeLessThanOrEqual(r.end);
        }
      }),
    );
  });
});
