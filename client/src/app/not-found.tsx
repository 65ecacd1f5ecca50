import { Link, useLocation } from 'react-router';
import { buttonClasses } from '@client/components/ui/button';

/** Any address the client does not know. */
export function NotFoundPage() {
  const location = useLocation();
  return (
    <section className="mx-auto max-w-[60ch] py-10" aria-labelledby="not-found-title" data-testid="not-found">
      <title>Page not found · Bondmark</title>
      <h1 id="not-found-title" className="font-serif text-[1.75rem] leading-tight font-semibold">
        Page not found
      </h1>
      <p className="mt-2">
        There is no page at <code className="num rounded-[2px] bg-wash px-1.5 py-0.5">{location.pathname}</code>. The
        link may be old, or the address mistyped.
      </p>
      <div className="mt-6">
        <Link to="/" className={buttonClasses('primary') + ' no-underline'}>
          Go to start page
        </Link>
      </div>
    </section>
  );
}
