import { CircleAlert, RotateCw } from 'lucide-react';
import { errorMessage } from '../../lib/api-client';
import { Button } from './button';

/** What a screen shows when its data could not be loaded, with a way to try again. */
export function ErrorState({
  title = 'This could not be loaded',
  error,
  onRetry,
}: {
  title?: string;
  error: unknown;
  onRetry?: () => void;
}) {
  return (
    <div
      role="alert"
      className="flex flex-col items-center gap-3 rounded-lg border border-danger-200 bg-white px-6 py-10 text-center"
    >
      <CircleAlert aria-hidden="true" className="size-7 text-danger-600" />
      <div>
        <p className="font-semibold text-ink-900">{title}</p>
        <p className="mt-1 text-sm text-ink-700">{errorMessage(error)}</p>
      </div>
      {onRetry && (
        <Button onClick={onRetry} icon={<RotateCw aria-hidden="true" className="size-4" />}>
          Try again
        </Button>
      )}
    </div>
  );
}
