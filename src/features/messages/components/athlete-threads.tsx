// A coach's view of one athlete's threads: the weeks with messages (newest first, unread counts), and the
// chosen week's thread (this week unless another is picked).
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { useThreadList } from '../api/queries';
import { MessageThread } from './message-thread';

export function AthleteThreads({
  athleteId,
  thisWeek,
  slotLabels,
}: {
  athleteId: number;
  thisWeek: string;
  slotLabels?: Record<string, string>;
}) {
  const [week, setWeek] = useState(thisWeek);
  const { data } = useThreadList(athleteId);
  const weeks = data?.items ?? [];
  return (
    <div className="flex flex-col gap-2">
      {weeks.length > 0 ? (
        <nav aria-label="Weeks with messages" className="flex flex-wrap gap-2">
          {weeks.some((t) => t.week === thisWeek) ? null : (
            <Button size="sm" variant={week === thisWeek ? 'primary' : 'secondary'} onClick={() => setWeek(thisWeek)}>
              This week
            </Button>
          )}
          {weeks.map((t) => (
            <Button
              key={t.week}
              size="sm"
              variant={week === t.week ? 'primary' : 'secondary'}
              aria-pressed={week === t.week}
              onClick={() => setWeek(t.week)}
            >
              {t.week}
              {t.unread > 0 ? ` · ${t.unread} new` : ''}
            </Button>
          ))}
        </nav>
      ) : null}
      <MessageThread athleteId={athleteId} week={week} side="coach" slotLabels={slotLabels} />
    </div>
  );
}
