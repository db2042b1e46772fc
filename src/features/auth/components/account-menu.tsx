// The account menu in the top bar: who is signed in, the list of signed-in devices and signing out of
// every device at once. A disclosure button: Escape or a click elsewhere closes it, focus returns to it.
import { Link } from 'react-router-dom';
import { useDisclosure } from '../../../components/ui/disclosure';
import type { Me, Role } from '../../../../shared/schemas';
import { useSignOutEverywhere } from '../api/use-sign-out';

const ROLE_LABEL: Record<Role, string> = { head_coach: 'Head coach', coach: 'Coach', athlete: 'Athlete' };

const ITEM = 'flex min-h-11 w-full items-center rounded px-3 text-left font-semibold text-ink-900 hover:bg-chalk-200';

export function AccountMenu({ me }: { me: Me }) {
  const { open, setOpen, id, root, button, onKeyDown } = useDisclosure();
  const everywhere = useSignOutEverywhere();

  return (
    <div ref={root} className="relative" onKeyDown={onKeyDown}>
      <button
        ref={button}
        type="button"
        aria-expanded={open}
        aria-controls={id}
        onClick={() => setOpen((o) => !o)}
        className="flex min-h-11 items-center gap-2 rounded-md px-2 text-left leading-tight hover:bg-ink-800"
      >
        <span className="hidden sm:block">
          <span className="block font-semibold text-chalk-50">{me.name}</span>
          <span className="text-ink-300">
            {ROLE_LABEL[me.role]} · {me.teamName}
          </span>
        </span>
        <span className="font-semibold text-chalk-50 sm:hidden">Account</span>
        <span aria-hidden className="text-ink-300">
          ▾
        </span>
      </button>
      {open ? (
        <div
          id={id}
          className="absolute right-0 z-20 mt-1 w-64 rounded-md border border-ink-300 bg-chalk-50 p-1 text-sm shadow-lg"
        >
          <p className="px-3 py-2 text-ink-700 sm:hidden">
            <span className="block font-semibold text-ink-900">{me.name}</span>
            {ROLE_LABEL[me.role]} · {me.teamName}
          </p>
          <ul>
            <li>
              <Link to="/devices" className={ITEM} onClick={() => setOpen(false)}>
                Signed-in devices
              </Link>
            </li>
            <li>
              <button
                type="button"
                className={ITEM}
                onClick={() => everywhere.mutate()}
                disabled={everywhere.isPending}
              >
                Sign out everywhere
              </button>
            </li>
          </ul>
          {everywhere.error ? (
            <p role="alert" className="px-3 py-2 text-breach-700">
              {everywhere.error.message}
            </p>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
