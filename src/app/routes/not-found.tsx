import { Link } from 'react-router-dom';
import { buttonClass } from '../../components/ui/button';

export function NotFound() {
  return (
    <section className="mx-auto max-w-xl p-6">
      <h1 className="text-2xl font-bold">Page not found</h1>
      <p className="mt-2 text-ink-700">
        There is no page at this address. It may have moved, or the link was mistyped.
      </p>
      <Link to="/" className={`${buttonClass('primary')} mt-4`}>
        Go to my start page
      </Link>
    </section>
  );
}
