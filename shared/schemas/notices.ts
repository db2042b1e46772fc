// Notices for coaches: what athletes did that a coach should look at, and the daily e-mail summary.
import { z } from 'zod';

export const NOTICE_KINDS = ['pain', 'top_set_low', 'top_set_missed', 'video', 'message'] as const;
export type NoticeKind = (typeof NOTICE_KINDS)[number];

export interface Notice {
  id: number;
  kind: NoticeKind;
  athleteId: number;
  week: string;
  text: string;
  /** Where in the app it leads. */
  path: string;
  read: boolean;
  createdAt: string;
}

export interface NoticeList {
  items: Notice[];
  total: number;
  unread: number;
}

export const noticeListQuery = z.object({
  limit: z.coerce.number().int().min(1).max(100).default(30),
  offset: z.coerce.number().int().min(0).default(0),
});

export const noticeSettingsBody = z.object({
  dailyEmail: z.boolean({ message: 'Choose on or off' }),
});
export type NoticeSettings = z.infer<typeof noticeSettingsBody>;

/** What `GET /api/events` sends as each event's data: what changed, so a page asks again for just that. */
export interface LiveEvent {
  id: number;
  topic: 'plan' | 'messages' | 'notices';
  /** The athlete it is about; null for coaches-only news (notices). */
  athleteId: number | null;
  weeks: string[];
}
