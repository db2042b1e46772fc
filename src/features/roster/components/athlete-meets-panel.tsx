// The meets this athlete is entered in, soonest first; entries and attempts are planned on Meets.
import { Link } from 'react-router-dom';
import type { Athlete } from '../../../../shared/schemas';
import { formatDate, whenText } from './labels';
import { Panel } from './panel';

export function AthleteMeetsPanel({ athlete }: { athlete: Athlete }) {
  return (
    <Panel title="Meets">
      {athlete.meets.length === 0 ? (
        <p className="text-ink-600">
          Not entered in a meet. Enter athletes on the{' '}
          <Link to="/meets" className="underline underline-offset-2">
            Meets
          </Link>{' '}
          page; the board tapers toward the next one.
        </p>
      ) : (
        <ul className="flex flex-col divide-y divide-chalk-300">
          {athlete.meets.map((m) => (
            <li key={m.entryId} className="flex flex-wrap items-baseline justify-between gap-2 py-2">
              <Link
                to={`/meets?meet=${m.meetId}`}
                className="font-semibold underline underline-offset-2 hover:text-rust-600"
              >
                {m.name}
              </Link>
              <span className="text-sm text-ink-700">
                {formatDate(m.date)} · {whenText(m.date)}
                {m.weightClass ? ` · ${m.weightClass} kg class` : ' · class not set'}
              </span>
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
