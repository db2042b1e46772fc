// The notices button in the top bar (coaches): the unread count in its name, a list that opens below it
// (Escape or a click elsewhere closes it, focus returns to the button), each notice a link into the app,
// "Mark all read", and the daily e-mail summary switch.
import { Link } from 'react-router-dom';
import { useDisclosure } from '../../../components/ui/disclosure';
import type { Notice } from '../../../../shared/schemas';
import { useMarkNoticeRead, useNoticeSettings, useNotices, useSetDailyEmail } from '../api/queries';

const stamp = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' });

const KIND_WORD: Record<Notice['kind'], string> = {
  pain: 'Pain',
  top_set_low: 'Top set',
  top_set_missed: 'Missed',
  video: 'Video',
  message: 'Message',
};

export function NoticeMenu() {
  const { open, setOpen, id, root, button, onKeyDown } = useDisclosure();
  const { data } = useNotices(true);
  const settings = useNoticeSettings(open);
  const markRead = useMarkNoticeRead();
  const setDaily = useSetDailyEmail();
  const unread = data?.unread ?? 0;

  return (
    <div ref={root} className="relative" onKeyDown={onKeyDown}>
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={id}
        onClick={() => setOpen((o) => !o)}
        className="flex min-h-11 items-center gap-2 rounded-md px-2 font-semibold text-chalk-50 hover:bg-ink-800"
      >
        <svg aria-hidden width="20" height="20" viewBox="0 0 20 20" className="fill-none stroke-current stroke-2">
          <path d="M3 4h14v9H8l-4 3v-3H3z" strokeLinejoin="round" />
        </svg>
        {/* The name reads "Notices 3 unread": the same words the button shows, and the count. */}
        <span className="sr-only sm:not-sr-only">Notices</span>
        {unread > 0 ? (
          <span className="min-w-6 rounded-full bg-rust-500 px-1.5 text-center text-sm text-chalk-50">
            {unread > 99 ? '99+' : unread}
          </span>
        ) : (
          <span className="sr-only">0</span>
        )}
        <span className="sr-only">unread</span>
      </button>
      {open ? (
        <div
          id={id}
          className="absolute right-0 z-30 mt-1 w-[min(24rem,calc(100vw-1.5rem))] rounded-md border border-ink-300 bg-chalk-50 p-2 text-sm text-ink-900 shadow-lg"
        >
          <div className="flex items-center justify-between gap-2 px-1 pb-2">
            <p className="text-base font-bold">Notices</p>
            <button
              type="button"
              className="min-h-11 rounded px-2 font-semibold text-ink-800 underline underline-offset-2 hover:bg-chalk-200 disabled:text-ink-400"
              disabled={unread === 0 || markRead.isPending}
              onClick={() => markRead.mutate('all')}
            >
              Mark all read
            </button>
          </div>
          {data && data.items.length > 0 ? (
            <ul aria-label="Notices" className="max-h-96 overflow-y-auto">
              {data.items.map((n) => (
                <li key={n.id}>
                  <Link
                    to={n.path}
                    onClick={() => {
                      if (!n.read) markRead.mutate(n.id);
                      setOpen(false);
                    }}
                    className={`block rounded px-2 py-2 hover:bg-chalk-200 ${n.read ? 'text-ink-700' : 'font-semibold'}`}
                  >
                    <span className="block">
                      {n.read ? '' : <span className="sr-only">Unread: </span>}
                      <span className="mr-1 rounded bg-chalk-200 px-1 text-xs font-semibold uppercase text-ink-800">
                        {KIND_WORD[n.kind]}
                      </span>
                      {n.text}
                    </span>
                    <span className="block text-xs font-normal text-ink-600">
                      {stamp.format(new Date(n.createdAt))}
                    </span>
                  </Link>
                </li>
              ))}
            </ul>
          ) : (
            <p className="px-2 py-3 text-ink-600">Nothing new from your athletes.</p>
          )}
          <label className="mt-2 flex min-h-11 items-center gap-2 border-t border-ink-200 px-2 pt-2">
            <input
              type="checkbox"
              className="h-5 w-5"
              checked={settings.data?.dailyEmail ?? true}
              disabled={!settings.data || setDaily.isPending}
              onChange={(e) => setDaily.mutate({ dailyEmail: e.target.checked })}
            />
            E-mail me a daily summary of unread notices
          </label>
          {setDaily.error ? (
            <p role="alert" className="px-2 text-breach-700">
              {setDaily.error.message}
            </p>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
