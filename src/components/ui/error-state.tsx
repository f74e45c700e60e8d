import { errorMessage, isApiError } from '../../lib/api-client';
import { Button } from './button';

function titleFor(err: unknown): string {
  if (!isApiError(err)) return 'Something went wrong';
  switch (err.status) {
    case 0:
      return 'No connection';
    case 401:
      return 'Please sign in';
    case 403:
      return 'Not allowed';
    case 404:
      return 'Not found';
    default:
      return 'Something went wrong';
  }
}

/** A failed load: what happened, in the server's words, and a retry when one makes sense. */
export function ErrorState({ error, onRetry, title, message }: { error: unknown; onRetry?: () => void; title?: string; message?: string }) {
  return (
    <div role="alert" className="flex flex-col items-center gap-3 rounded-lg border border-rose-900/70 bg-rose-950/30 px-6 py-8 text-center">
      <h3 className="text-sm font-semibold text-rose-200">{title ?? titleFor(error)}</h3>
      <p className="max-w-md text-sm text-slate-300">{message ?? errorMessage(error)}</p>
      {onRetry && (
        <Button size="sm" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}
