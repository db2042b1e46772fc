// The coach's review panel on an athlete's page: connective-tissue suggestions and pain flags, recent
// check-ins, top-set videos to watch and comment on, then the history the page composes in (charts).
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { formatWeight, type WeightUnit } from '../../../../shared/calc';
import { TISSUE_CAUTION } from '../../../../shared/engine/tissue';
import { jointName } from '../../../../shared/engine/words';
import { TISSUE_KIND_WORD, tissueDoseLabel, tissueSessionsLabel } from '../../../../shared/labels';
import type { ReactNode } from 'react';
import {
  videoCommentBody,
  type AthleteReview as AthleteReviewData,
  type Video,
  type VideoCommentBody,
} from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/field';
import { CleanIcon, WarningIcon } from '../../../components/ui/icons';
import { Loading, Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { useMe } from '../../../lib/me';
import { useAthleteReview } from '../api/queries';
import { useAddComment } from '../api/use-add-comment';

const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** The week's own notes (why a joint is out, what changed), without the cautions repeated on every page. */
function weekNotes(notes: string[]): string[] {
  const cautions = new Set<string>(TISSUE_CAUTION);
  return notes.filter((n) => !cautions.has(n));
}

function CommentForm({ athleteId, videoId }: { athleteId: number; videoId: number }) {
  const add = useAddComment(athleteId);
  const form = useForm<VideoCommentBody, unknown, z.output<typeof videoCommentBody>>({
    resolver: zodResolver(videoCommentBody),
    defaultValues: { body: '' },
  });
  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await add.mutateAsync({ videoId, ...values });
      form.reset({ body: '' });
    } catch (err) {
      if (isApiError(err) && err.fields.body) form.setError('body', { message: err.fields.body[0] });
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2" aria-label="Comment on this video">
      {add.error && !(isApiError(add.error) && add.error.fields.body) ? (
        <Notice tone="error">{add.error.message}</Notice>
      ) : null}
      <TextAreaField label="Comment" rows={2} error={form.formState.errors.body?.message} {...form.register('body')} />
      <Button type="submit" variant="secondary" className="self-start" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? 'Saving…' : 'Add comment'}
      </Button>
    </form>
  );
}

function VideoCard({ video, athleteId, unit }: { video: Video; athleteId: number; unit: WeightUnit }) {
  const s = video.topSet;
  const title = s
    ? `${s.variantName}: ${s.reps} × ${formatWeight(s.weightKg, unit, { decimals: 1 })}`
    : 'Top-set video';
  return (
    <li className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-chalk-50 p-3">
      <div>
        <p className="font-semibold text-ink-900">{title}</p>
        <p className="text-sm text-ink-600">
          {s
            ? `${s.performedOn} · e1RM ${formatWeight(s.e1rmKg, unit, { decimals: 1 })}${s.rpe ? ` · RPE ${s.rpe}` : ''}`
            : ''}
          {s?.note ? ` · “${s.note}”` : ''}
        </p>
      </div>
      <video
        controls
        preload="metadata"
        src={video.url}
        className="aspect-video w-full rounded-md bg-ink-950"
        aria-label={`Video: ${title}`}
      ></video>
      {video.comments.length > 0 ? (
        <ul className="flex flex-col gap-2" aria-label="Comments">
          {video.comments.map((c) => (
            <li key={c.id} className="rounded-md bg-chalk-100 px-3 py-2 text-ink-900">
              <p>{c.body}</p>
              <p className="text-sm text-ink-600">
                {c.authorName ?? 'A former coach'} · {c.createdAt.slice(0, 10)}
              </p>
            </li>
          ))}
        </ul>
      ) : null}
      <CommentForm athleteId={athleteId} videoId={video.id} />
    </li>
  );
}

/** What the review shows below the videos: the athlete's charts and records, composed by the page. */
export type ReviewHistory = (data: Pick<AthleteReviewData, 'series' | 'variants'>, unit: WeightUnit) => ReactNode;

export function AthleteReview({ athleteId, history }: { athleteId: number; history: ReviewHistory }) {
  const { data, error } = useAthleteReview(athleteId);
  const unit: WeightUnit = useMe().data?.unit ?? 'kg';
  if (error) return <Notice tone="error">{error.message}</Notice>;
  if (!data) return <Loading label="Loading the review…" />;
  return (
    <section aria-labelledby="review-heading" className="flex flex-col gap-5">
      <h2 id="review-heading" className="text-2xl font-bold text-ink-900">
        Review: {data.athlete.name}
      </h2>

      <section aria-labelledby="suggestions-heading" className="flex flex-col gap-2">
        <h3 id="suggestions-heading" className="text-xl font-bold text-ink-900">
          Connective tissue
        </h3>
        {data.suggestions.length === 0 ? (
          <p className="flex items-center gap-2 text-ink-700">
            <CleanIcon className="text-clean-700" /> No pain flagged in recent check-ins, and no work still sore.
          </p>
        ) : (
          <ul className="flex flex-col gap-2">
            {data.suggestions.map((s) => (
              <li
                key={`${s.joint}-${s.reason}`}
                className="flex gap-2 rounded-md border border-caution-600/50 bg-caution-100 p-3 text-ink-900"
              >
                <WarningIcon className="mt-0.5 shrink-0 text-caution-700" />
                <p>
                  <strong>
                    {s.reason === 'pain' ? 'Pain flagged' : 'Still sore'}: {jointName(s.joint)}.
                  </strong>{' '}
                  {s.message}
                </p>
              </li>
            ))}
          </ul>
        )}
        <div className="flex flex-col gap-1">
          <h4 className="font-semibold text-ink-800">
            This week ({data.tissue.week}): {data.tissue.kind ? TISSUE_KIND_WORD[data.tissue.kind] : 'no tissue work'}
          </h4>
          {data.tissue.items.length > 0 ? (
            <ul className="flex flex-col gap-1" aria-label="This week’s connective-tissue work">
              {data.tissue.items.map((item) => (
                <li key={`${item.joint}-${item.kind}`} className="rounded-md bg-chalk-100 px-3 py-2 text-ink-900">
                  <span className="font-semibold">{cap(jointName(item.joint))}:</span> {item.exercise} ·{' '}
                  {tissueDoseLabel(item)} ·{' '}
                  <span className="font-semibold">{tissueSessionsLabel(item.sessionsPerWeek)}</span>
                </li>
              ))}
            </ul>
          ) : null}
          {weekNotes(data.tissue.notes).map((n) => (
            <p key={n} className="text-sm text-ink-700">
              {n}
            </p>
          ))}
        </div>
        {data.checkins.length > 0 ? (
          <div className="overflow-x-auto">
            <table className="w-full text-left text-sm">
              <caption className="mb-1 text-left font-semibold text-ink-800">Recent next-day check-ins</caption>
              <thead className="text-ink-600">
                <tr>
                  <th className="py-1 pr-3 font-semibold">Week</th>
                  <th className="py-1 pr-3 font-semibold">Work</th>
                  <th className="py-1 pr-3 font-semibold">Soreness</th>
                  <th className="py-1 pr-3 font-semibold">Pain</th>
                  <th className="py-1 font-semibold">Note</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-ink-200 text-ink-900">
                {data.checkins.map((c) => (
                  <tr key={c.id}>
                    <td className="py-1 pr-3">{c.week}</td>
                    <td className="py-1 pr-3">{TISSUE_KIND_WORD[c.kind]}</td>
                    <td className="py-1 pr-3">{c.soreness}/10</td>
                    <td className="py-1 pr-3">
                      {c.painJoints.length ? (
                        <span className="inline-flex items-center gap-1 font-semibold text-breach-700">
                          <WarningIcon /> {c.painJoints.map(jointName).join(', ')}
                        </span>
                      ) : (
                        'none'
                      )}
                    </td>
                    <td className="py-1">{c.note ?? ''}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : null}
      </section>

      <section aria-labelledby="videos-heading" className="flex flex-col gap-2">
        <h3 id="videos-heading" className="text-xl font-bold text-ink-900">
          Top-set videos
        </h3>
        {data.videos.length === 0 ? (
          <p className="text-ink-700">No videos uploaded yet.</p>
        ) : (
          <ul className="grid grid-cols-1 gap-3 lg:grid-cols-2">
            {data.videos.map((v) => (
              <VideoCard key={v.id} video={v} athleteId={athleteId} unit={unit} />
            ))}
          </ul>
        )}
      </section>

      {history(data, unit)}
    </section>
  );
}
