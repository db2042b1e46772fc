// Messages: a short thread per athlete and week between the athlete and the team's coaches.
import { z } from 'zod';
import { idParam, isoWeek } from './common';

export const MESSAGE_MAX_LENGTH = 2000;

/** A thread is named by its athlete and week. */
export const threadParams = z.object({ athleteId: idParam, week: isoWeek });

/** A board cell of the thread's athlete that a coach's reply opens with one click. */
export const cellLinkSchema = z.object({
  week: isoWeek,
  slotId: z.string().trim().min(1, 'Pick a slot').max(32, 'At most 32 characters'),
});
export type CellLink = z.infer<typeof cellLinkSchema>;

export const sendMessageBody = z.object({
  body: z
    .string({ message: 'Write a message' })
    .trim()
    .min(1, 'Write a message')
    .max(MESSAGE_MAX_LENGTH, `At most ${MESSAGE_MAX_LENGTH} characters`),
  link: cellLinkSchema.optional(),
});
export type SendMessageInput = z.input<typeof sendMessageBody>;

export const threadListQuery = z.object({
  limit: z.coerce.number().int().min(1).max(100).default(30),
  offset: z.coerce.number().int().min(0).default(0),
  /** Coaches: one athlete's threads only. */
  athleteId: idParam.optional(),
});

export interface Message {
  id: number;
  athleteId: number;
  week: string;
  authorRole: 'athlete' | 'coach';
  authorName: string | null;
  /** True for the caller's own messages. */
  mine: boolean;
  body: string;
  link: CellLink | null;
  createdAt: string;
}

export interface MessageThread {
  athleteId: number;
  athleteName: string;
  week: string;
  /** Oldest first. */
  items: Message[];
  /** Messages from the other side that the caller has not read yet. */
  unread: number;
}

export interface ThreadSummary {
  athleteId: number;
  athleteName: string;
  week: string;
  lastMessage: Message;
  count: number;
  unread: number;
}
