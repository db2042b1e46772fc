// The athlete's own top-set videos with what the coaches said about each.
import { formatWeight, type WeightUnit } from '../../../../shared/calc';
import type { Video } from '../../../../shared/schemas';

export function MyVideos({ videos, unit }: { videos: Video[]; unit: WeightUnit }) {
  return (
    <section aria-labelledby="my-videos-heading" className="flex flex-col gap-3">
      <h2 id="my-videos-heading" className="text-xl font-bold text-ink-900">
        Videos and coach comments
      </h2>
      {videos.length === 0 ? (
        <p className="text-ink-600">No videos yet. Add one when you log a top set.</p>
      ) : (
        <ul className="grid grid-cols-1 gap-3 lg:grid-cols-2">
          {videos.map((v) => {
            const s = v.topSet;
            const title = s
              ? `${s.variantName}: ${s.reps} × ${formatWeight(s.weightKg, unit, { decimals: 1 })}`
              : 'Top-set video';
            return (
              <li key={v.id} className="flex flex-col gap-2 rounded-lg border border-ink-200 bg-chalk-50 p-3">
                <p className="font-semibold text-ink-900">{title}</p>
                {s ? <p className="text-sm text-ink-600">{s.performedOn}</p> : null}
                <video
                  controls
                  preload="metadata"
                  src={v.url}
                  className="aspect-video w-full rounded-md bg-ink-950"
                  aria-label={`Video: ${title}`}
                />
                {v.comments.length === 0 ? (
                  <p className="text-sm text-ink-600">No comments from your coaches yet.</p>
                ) : (
                  <ul className="flex flex-col gap-2" aria-label="Coach comments">
                    {v.comments.map((c) => (
                      <li key={c.id} className="rounded-md bg-chalk-100 px-3 py-2 text-ink-900">
                        <p>{c.body}</p>
                        <p className="text-sm text-ink-600">
                          {c.authorName ?? 'A former coach'} · {c.createdAt.slice(0, 10)}
                        </p>
                      </li>
                    ))}
                  </ul>
                )}
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
