// One athlete-and-week thread: the messages, a reply box with a length count, read marks as the thread is
// shown, and (coaches) the option to attach the board cell being looked at.
import { useEffect, useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { MESSAGE_MAX_LENGTH, sendMessageBody, type CellLink, type Message } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { TextAreaField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { useThread } from '../api/queries';
import { useMarkThreadRead, useSendMessage } from '../api/use-send-message';

const formSchema = sendMessageBody.pick({ body: true });
type FormValues = z.input<typeof formSchema>;

const stamp = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  hour: '2-digit',
  minute: '2-digit',
});

/** Where a coach's cell link leads: the Board with that cell's details open. */
export function boardCellHref(athleteId: number, link: CellLink): string {
  const q = new URLSearchParams({ athlete: String(athleteId), week: link.week, slot: link.slotId });
  return `/board?${q.toString()}`;
}

function LinkOut({
  athleteId,
  link,
  side,
  slotLabels,
}: {
  athleteId: number;
  link: CellLink;
  side: 'athlete' | 'coach';
  slotLabels?: Record<string, string>;
}) {
  const slot = slotLabels?.[link.slotId] ?? link.slotId;
  const cls = 'mt-1 inline-flex min-h-11 items-center font-semibold text-ink-800 underline underline-offset-2';
  return side === 'coach' ? (
    <Link className={cls} to={boardCellHref(athleteId, link)}>
      Open {slot}, {link.week} on the Board
    </Link>
  ) : (
    <Link className={cls} to={`/my-week?week=${link.week}`}>
      See {slot} in {link.week}
    </Link>
  );
}

function MessageItem({
  m,
  side,
  slotLabels,
}: {
  m: Message;
  side: 'athlete' | 'coach';
  slotLabels?: Record<string, string>;
}) {
  const who = m.mine ? 'You' : (m.authorName ?? (m.authorRole === 'coach' ? 'A former coach' : 'The athlete'));
  return (
    <li
      className={`rounded-md border px-3 py-2 ${
        m.authorRole === 'coach' ? 'border-ink-200 bg-chalk-100' : 'border-rust-300/60 bg-chalk-50'
      }`}
    >
      <p className="text-sm text-ink-600">
        <span className="font-semibold text-ink-800">{who}</span>
        {m.authorRole === 'coach' && !m.mine ? ' (coach)' : ''} ·{' '}
        <time dateTime={m.createdAt}>{stamp.format(new Date(m.createdAt))}</time>
      </p>
      <p className="whitespace-pre-wrap break-words text-ink-900">{m.body}</p>
      {m.link ? <LinkOut athleteId={m.athleteId} link={m.link} side={side} slotLabels={slotLabels} /> : null}
    </li>
  );
}

export function MessageThread({
  athleteId,
  week,
  side,
  cell,
  slotLabels,
  heading = 'h2',
  title = 'Messages',
}: {
  athleteId: number;
  week: string;
  side: 'athlete' | 'coach';
  /** Coaches: the cell on screen, offered as a link in the reply. */
  cell?: CellLink & { label: string };
  slotLabels?: Record<string, string>;
  heading?: 'h2' | 'h3';
  title?: string;
}) {
  const { data, error, isPending } = useThread(athleteId, week);
  const send = useSendMessage(athleteId, week);
  const markRead = useMarkThreadRead(athleteId, week);
  const [attach, setAttach] = useState(true);
  const headingId = useId();
  const form = useForm<FormValues, unknown, z.output<typeof formSchema>>({
    resolver: zodResolver(formSchema),
    defaultValues: { body: '' },
  });
  const length = useWatch({ control: form.control, name: 'body' })?.length ?? 0;

  const unread = data?.unread ?? 0;
  const { mutate: mark, isPending: marking } = markRead;
  useEffect(() => {
    if (unread > 0 && !marking) mark();
  }, [unread, marking, mark]);

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await send.mutateAsync({
        body: values.body,
        ...(cell && attach ? { link: { week: cell.week, slotId: cell.slotId } } : {}),
      });
      form.reset({ body: '' });
    } catch (err) {
      if (isApiError(err) && err.fields.body) form.setError('body', { message: err.fields.body[0] });
    }
  });

  const Heading = heading;
  const items = data ? (side === 'coach' ? [...data.items].reverse() : data.items) : [];
  const list = isPending ? (
    <p className="text-sm text-ink-500">Loading messages…</p>
  ) : error ? (
    <Notice tone="error">{error.message}</Notice>
  ) : items.length === 0 ? (
    <p className="text-sm text-ink-600">
      {side === 'athlete'
        ? 'No messages this week. Ask your coaches about anything in this week.'
        : 'No messages in this week yet.'}
    </p>
  ) : (
    <ol className="flex flex-col gap-2" aria-label={side === 'coach' ? 'Messages, newest first' : 'Messages'}>
      {items.map((m) => (
        <MessageItem key={m.id} m={m} side={side} slotLabels={slotLabels} />
      ))}
    </ol>
  );

  const replyForm = (
    <form
      onSubmit={onSubmit}
      noValidate
      className="flex flex-col gap-2"
      aria-label={`Write to ${side === 'athlete' ? 'your coaches' : (data?.athleteName ?? 'the athlete')}`}
    >
      {send.error && !(isApiError(send.error) && send.error.fields.body) ? (
        <Notice tone="error">{send.error.message}</Notice>
      ) : null}
      <TextAreaField
        label={side === 'athlete' ? 'Message to your coaches' : 'Reply'}
        rows={3}
        maxLength={MESSAGE_MAX_LENGTH * 2}
        hint={`${length} of ${MESSAGE_MAX_LENGTH} characters`}
        error={form.formState.errors.body?.message}
        {...form.register('body')}
      />
      {cell ? (
        <label className="flex min-h-11 items-center gap-2 text-sm text-ink-800">
          <input type="checkbox" className="h-5 w-5" checked={attach} onChange={(e) => setAttach(e.target.checked)} />
          Link this cell ({cell.label})
        </label>
      ) : null}
      <Button type="submit" variant="secondary" className="self-start" disabled={form.formState.isSubmitting}>
        {form.formState.isSubmitting ? 'Sending…' : 'Send'}
      </Button>
    </form>
  );

  return (
    <section
      aria-labelledby={headingId}
      className="flex flex-col gap-3 rounded-lg border border-ink-200 bg-chalk-50 p-3"
    >
      <Heading id={headingId} className="text-lg font-bold text-ink-900">
        {title} <span className="text-sm font-normal text-ink-600">· {week}</span>
      </Heading>
      {side === 'coach' ? (
        <>
          {replyForm}
          {list}
        </>
      ) : (
        <>
          {list}
          {replyForm}
        </>
      )}
    </section>
  );
}
