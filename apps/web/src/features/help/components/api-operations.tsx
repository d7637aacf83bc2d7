import { useDeferredValue, useId, useState } from 'react';
import { Input } from '../../../components/ui/input';
import { cn } from '../../../lib/cn';
import type { ApiOperation } from '../api';

const methodStyles: Record<ApiOperation['method'], string> = {
  get: 'border-ink-300 bg-ink-50 text-ink-800',
  post: 'border-accent-300 bg-accent-50 text-accent-800',
  put: 'border-accent-300 bg-accent-50 text-accent-800',
  patch: 'border-accent-300 bg-accent-50 text-accent-800',
  delete: 'border-danger-200 bg-danger-50 text-danger-700',
};

function accessWords(access: string): string {
  if (access === 'public') return 'public';
  if (access === 'signed-in') return 'signed in';
  return access;
}

function matches(operation: ApiOperation, words: string[]): boolean {
  const text =
    `${operation.method} ${operation.path} ${operation.summary} ${operation.tag} ${operation.access}`.toLowerCase();
  return words.every((word) => text.includes(word));
}

/**
 * The API's operations grouped by tag: method, path, who may call it and what it does, with
 * a filter box (words anywhere in method, path, summary or access).
 */
export function ApiOperations({ operations }: { operations: ApiOperation[] }) {
  const [filter, setFilter] = useState('');
  const deferred = useDeferredValue(filter);
  const filterId = useId();
  const words = deferred.toLowerCase().split(/\s+/).filter(Boolean);
  const shown = operations.filter((operation) => matches(operation, words));
  const tags = [...new Set(shown.map((operation) => operation.tag))].sort();

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <div className="w-full max-w-sm">
          <label htmlFor={filterId} className="mb-1 block text-sm font-medium text-ink-800">
            Filter operations
          </label>
          <Input
            id={filterId}
            type="search"
            value={filter}
            placeholder="e.g. draws, post containers, stock.write"
            onChange={(event) => setFilter(event.target.value)}
          />
        </div>
        <p className="text-sm text-ink-600" aria-live="polite">
          {shown.length === operations.length
            ? `${operations.length} operations`
            : `${shown.length} of ${operations.length} operations`}
        </p>
      </div>
      {tags.length === 0 && (
        <p className="text-sm text-ink-700">No operation matches “{deferred}”.</p>
      )}
      {tags.map((tag) => (
        <section key={tag} aria-label={`Operations: ${tag}`} className="flex flex-col gap-1">
          <h3 className="font-mono text-sm font-semibold text-ink-900">{tag}</h3>
          <ul className="flex flex-col divide-y divide-ink-100 rounded-md border border-ink-200 bg-white">
            {shown
              .filter((operation) => operation.tag === tag)
              .map((operation) => (
                <li
                  key={`${operation.method} ${operation.path}`}
                  className="flex flex-wrap items-baseline gap-x-3 gap-y-0.5 px-3 py-1.5 text-sm"
                >
                  <span
                    className={cn(
                      'w-16 shrink-0 rounded border px-1 text-center font-mono text-xs font-semibold uppercase',
                      methodStyles[operation.method],
                    )}
                  >
                    {operation.method}
                  </span>
                  <code className="min-w-0 font-mono text-ink-900 [overflow-wrap:anywhere]">
                    {operation.path}
                  </code>
                  <span className="text-ink-700">{operation.summary}</span>
                  <span className="ml-auto text-xs text-ink-600">
                    <span className="sr-only">Access: </span>
                    {accessWords(operation.access)}
                  </span>
                </li>
              ))}
          </ul>
        </section>
      ))}
    </div>
  );
}
