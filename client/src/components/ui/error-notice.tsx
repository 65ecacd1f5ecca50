import { isApiError } from '@client/lib/api';
import { Button } from './button';

/** Inline message for a failed request inside a page (the page itself still works). */
export function ErrorNotice({ error, onRetry, what }: { error: unknown; onRetry?: () => void; what: string }) {
  const code = isApiError(error) ? error.code : 'internal';
  const message = error instanceof Error ? error.message : 'Something unexpected happened.';
  return (
    <div
      role="alert"
      className="flex flex-wrap items-start justify-between gap-3 rounded-[3px] border border-antibonding/50 bg-sheet px-4 py-3"
      data-testid="error-notice"
    >
      <div>
        <p className="font-semibold text-antibonding">Could not load {what}.</p>
        <p className="text-ink">
          {message} <span className="num text-graphite">({code})</span>
        </p>
      </div>
      {onRetry ? (
        <Button size="sm" onClick={onRetry}>
          Try again
        </Button>
      ) : null}
    </div>
  );
}
