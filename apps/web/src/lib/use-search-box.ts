import { useEffect, useState } from 'react';
import { useDebouncedValue } from './use-debounced-value';

/**
 * The text of a list's search box. It follows the URL's `q` (Back, "Clear filters") and
 * hands what was typed to `onCommit` once typing pauses.
 */
export function useSearchBox(q: string, onCommit: (q: string) => void, delayMs = 300) {
  const [text, setText] = useState(q);
  const [seenQ, setSeenQ] = useState(q);
  if (q !== seenQ) {
    setSeenQ(q);
    setText(q);
  }
  const debounced = useDebouncedValue(text, delayMs);
  useEffect(() => {
    // Only a settled value is written, so a stale one never undoes a change from the URL.
    if (debounced === text && debounced.trim() !== q) onCommit(debounced);
  }, [debounced, text, q, onCommit]);
  return [text, setText] as const;
}
