// Contracts of the weekly loop: a cell's ranked alternatives, the cells whose status a save changed,
// and publishing a week with its check first (dry run), as zod schemas the client decodes answers with.
import { z } from 'zod';
import type { RuleId } from '../engine/types';
import { publicationSchema } from './mail';

export const cellStatusSchema = z.enum(['clean', 'warning', 'break']);
export type CellStatusName = z.infer<typeof cellStatusSchema>;

export interface AlternativeItem {
  variantId: number;
  name: string;
  status: CellStatusName;
  reasons: string[];
  /** The rules a "break" breaks. */
  rules: RuleId[];
  /** The cell holds this variant now. */
  current: boolean;
}

export interface AlternativesResponse {
  /** Sorted clean → warning → break; within each, the preferred first. */
  items: AlternativeItem[];
  summary: { clean: number; warning: number; break: number; blockedBy: { rule: RuleId; count: number }[] };
}

/** Another cell whose status a save changed (an override next door can make a pick repeat too soon). */
export const cellStatusChangeSchema = z.object({
  athleteId: z.number(),
  week: z.string(),
  slotId: z.string(),
  variantId: z.number(),
  from: cellStatusSchema,
  to: cellStatusSchema,
  reasons: z.array(z.string()),
});
export type CellStatusChange = z.infer<typeof cellStatusChangeSchema>;

export const publishBody = z
  .object({
    /** Only the check: nothing is stored or sent. */
    dryRun: z.boolean({ message: 'Must be true or false' }).default(false),
  })
  .strict();
export type PublishBody = z.input<typeof publishBody>;

const athleteRef = { athleteId: z.number(), athleteName: z.string() };
const listOf = <T extends z.ZodTypeAny>(item: T) => z.object({ count: z.number(), items: z.array(item) });

export const publishCheckSchema = z.object({
  week: z.string(),
  /** Max-effort cells with nothing in them. */
  emptyCells: listOf(z.object({ ...athleteRef, slotId: z.string(), slotLabel: z.string() })),
  /** Picks that break a rule and carry no reason. */
  unexplainedBreaks: listOf(
    z.object({
      ...athleteRef,
      slotId: z.string(),
      slotLabel: z.string(),
      variantName: z.string(),
      messages: z.array(z.string()),
    }),
  ),
  /** Athletes who cannot see the week: no account yet. */
  withoutAccount: listOf(z.object({ ...athleteRef, email: z.string().nullable() })),
  /** Who would get an e-mail, first plan or update, and what changed for an update. */
  wouldEmail: listOf(
    z.object({ ...athleteRef, email: z.string(), kind: z.enum(['plan', 'update']), changes: z.array(z.string()) }),
  ),
});
export type PublishCheck = z.infer<typeof publishCheckSchema>;

export const publishResultSchema = publicationSchema.extend({
  alreadyPublished: z.boolean(),
  /** Athletes whose week was published now (first time or with changes), and e-mails queued. */
  athletesPublished: z.number(),
  emailsQueued: z.number(),
  check: publishCheckSchema,
});
export type PublishResult = z.infer<typeof publishResultSchema>;
