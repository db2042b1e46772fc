// Live updates on the client: which cached answers an event or an opening stream asks for again.
import { describe, expect, it, vi } from 'vitest';
import { QueryClient } from '@tanstack/react-query';
import { invalidateAll, invalidateFor } from '../../../src/app/live-events';
import { myWeekKeys } from '../../../src/features/my-week/api/queries';
import { messageKeys } from '../../../src/features/messages/api/queries';

function client() {
  return new QueryClient({ defaultOptions: { queries: { retry: false } } });
}
const stale = (qc: QueryClient, key: readonly unknown[]) => qc.getQueryState(key)?.isInvalidated ?? null;

describe('live events on the client', () => {
  it("a plan change asks again for the athlete's current week and the weeks it names, nothing else", () => {
    const qc = client();
    qc.setQueryData(myWeekKeys.week(null), { n: 1 });
    qc.setQueryData(myWeekKeys.week('2026-W50'), { n: 2 });
    qc.setQueryData(myWeekKeys.week('2026-W51'), { n: 3 });
    qc.setQueryData(messageKeys.thread(7, '2026-W50'), { n: 4 });
    invalidateFor(qc, 'athlete', { id: 1, topic: 'plan', athleteId: 7, weeks: ['2026-W50'] });
    expect(stale(qc, myWeekKeys.week(null))).toBe(true);
    expect(stale(qc, myWeekKeys.week('2026-W50'))).toBe(true);
    expect(stale(qc, myWeekKeys.week('2026-W51'))).toBe(false);
    expect(stale(qc, messageKeys.thread(7, '2026-W50'))).toBe(false);
  });

  it('a stream opening after the page read its data asks again only for what was read before it began', () => {
    vi.useFakeTimers();
    try {
      const qc = client();
      vi.setSystemTime(1_000);
      qc.setQueryData(myWeekKeys.week(null), { n: 1 });
      vi.setSystemTime(2_000);
      const streamStarted = Date.now();
      vi.setSystemTime(2_500);
      qc.setQueryData(myWeekKeys.week('2026-W50'), { n: 2 });
      invalidateAll(qc, 'athlete', streamStarted);
      expect(stale(qc, myWeekKeys.week(null))).toBe(true);
      expect(stale(qc, myWeekKeys.week('2026-W50'))).toBe(false);
      // A reconnect (no time given) asks again for everything the stream covers.
      invalidateAll(qc, 'athlete');
      expect(stale(qc, myWeekKeys.week('2026-W50'))).toBe(true);
    } finally {
      vi.useRealTimers();
    }
  });
});
