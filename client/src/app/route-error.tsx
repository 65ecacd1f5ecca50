import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { isApiError } from '@client/lib/api';
import { buttonClasses } from '@client/components/ui/button';

interface Described {
  title: string;
  message: string;
  code: string;
  status: number | null;
}

/** Turns whatever a route threw into a calm sentence and a code. */
export function describeRouteError(error: unknown): Described {
  if (isRouteErrorResponse(error)) {
    const notFound = error.status === 404;
    return {
      title: notFound ? 'Page not found' : 'Something went wrong',
      message:
        typeof error.data === 'string' && error.data
          ? error.data
          : notFound
            ? 'There is no page at this address.'
            : error.statusText || 'The page could not be shown.',
      code: notFound ? 'not_found' : `http_${error.status}`,
      status: error.status,
    };
  }
  if (isApiError(error)) {
    const titles: Record<string, string> = {
      forbidden: 'No access to this page',
      not_found: 'Not found',
      network_error: 'Bondmark could not be reached',
      unauthenticated: 'Your session has ended',
    };
    return {
      title: titles[error.code] ?? 'Something went wrong',
      message: error.message,
      code: error.code,
      status: error.status || null,
    };
  }
  return {
    title: 'Something went wrong',
    message: 'This page ran into a problem it did not expect. Your data is safe; try again, or go back.',
    code: 'internal',
    status: null,
  };
}

/** errorElement of the routes: what happened, the error code, and a way back. */
export function RouteError() {
  const error = useRouteError();
  const described = describeRouteError(error);
  return (
    <section className="mx-auto max-w-[60ch] py-10" aria-labelledby="route-error-title" data-testid="route-error">
      <title>{`${described.title} · Bondmark`}</title>
      <h1 id="route-error-title" className="font-serif text-[1.75rem] leading-tight font-semibold">
        {described.title}
      </h1>
      <p className="mt-2 text-ink">{described.message}</p>
      <p className="mt-3 text-sm text-graphite">
        Error code{' '}
        <code className="num rounded-[2px] bg-wash px-1.5 py-0.5 text-ink" data-testid="error-code">
          {described.code}
        </code>
        {described.status ? (
          <>
            {' '}
            · status <span className="num text-ink">{described.status}</span>
          </>
        ) : null}
      </p>
      <div className="mt-6 flex flex-wrap gap-2">
        <Link to="/" className={buttonClasses('primary') + ' no-underline'}>
          Go to start page
        </Link>
        <button type="button" className={buttonClasses('secondary')} onClick={() => window.location.reload()}>
          Try again
        </button>
      </div>
      {import.meta.env.DEV && error instanceof Error && error.stack ? (
        <details className="mt-6 text-sm">
          <summary className="cursor-pointer text-graphite">Details for developers</summary>
          <pre className="mt-2 overflow-x-auto rounded-[3px] bg-wash p-3 text-[0.8rem]">{error.stack}</pre>
        </details>
      ) : null}
    </section>
  );
}
