import { Fragment } from 'react';
import { keyName, type Shortcut } from '../../lib/shortcuts';

/** One key as a keycap; read aloud by its name (“slash”, “question mark”). */
export function Key({ name }: { name: string }) {
  return (
    <kbd
      aria-label={keyName(name)}
      className="inline-flex min-w-7 items-center justify-center rounded border border-ink-300 border-b-2 bg-ink-50 px-1.5 py-0.5 font-mono text-sm text-ink-900"
    >
      {name}
    </kbd>
  );
}

/** The keys of a shortcut in order: `g` then `s`. */
export function ShortcutKeys({ keys }: { keys: readonly string[] }) {
  return (
    <span className="inline-flex items-center gap-1 whitespace-nowrap">
      {keys.map((key, index) => (
        <Fragment key={`${key}-${index}`}>
          {index > 0 && <span className="text-xs text-ink-600">then</span>}
          <Key name={key} />
        </Fragment>
      ))}
    </span>
  );
}

/** The keyboard shortcuts as a list of keys and what they do (overlay and help page). */
export function ShortcutList({ items }: { items: readonly Shortcut[] }) {
  return (
    <dl className="flex flex-col divide-y divide-ink-100">
      {items.map((shortcut) => (
        <div
          key={shortcut.id}
          className="grid gap-1 py-2.5 sm:grid-cols-[8rem_1fr] sm:items-baseline sm:gap-3"
        >
          <dt>
            <ShortcutKeys keys={shortcut.keys} />
          </dt>
          <dd>
            <span className="block text-sm font-medium text-ink-900">{shortcut.label}</span>
            <span className="block text-sm text-ink-600">{shortcut.detail}</span>
          </dd>
        </div>
      ))}
    </dl>
  );
}
