// Videos of top sets and the coaches' comments on them, and the coach's review of one athlete.
import type { Division, Sex } from '../calc/classes';
import { z } from 'zod';
import type { TissueSuggestion } from '../engine/tissue';
import type { Series, TissueCheckinRow, TissueWorkWeek, TopSet, VariantHistory } from './training';

/** Containers a video may come in, checked from the file's content, never its name. */
export const VIDEO_TYPES = { mp4: 'video/mp4', mov: 'video/quicktime', webm: 'video/webm' } as const;
export const VIDEO_FIELD = 'video';

export const videoCommentBody = z.object({
  body: z.string().trim().min(1, 'Write a comment').max(2000, 'At most 2000 characters'),
});
export type VideoCommentBody = z.input<typeof videoCommentBody>;

export interface VideoComment {
  id: number;
  body: string;
  authorName: string | null;
  createdAt: string;
}

export interface Video {
  id: number;
  athleteId: number;
  contentType: string;
  sizeBytes: number;
  originalName: string | null;
  createdAt: string;
  /** Where the browser plays it from (streamed through the app, with byte ranges). */
  url: string;
  topSet: TopSet | null;
  comments: VideoComment[];
}

export interface AthleteReview {
  athlete: { id: number; name: string; sex: Sex; division: Division };
  week: string;
  /** Restrictions to consider (pain flagged in recent check-ins) and work still sore on the lightest band. */
  suggestions: TissueSuggestion[];
  /** This week's connective-tissue work, as the athlete sees it. */
  tissue: TissueWorkWeek;
  checkins: TissueCheckinRow[];
  videos: Video[];
  variants: VariantHistory[];
  series: Series;
}
