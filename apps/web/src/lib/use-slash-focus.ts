import { useEffect, type RefObject } from 'react';
import { registerSlashTarget } from './shortcuts';

/**
 * Makes `/` (pressed outside a text field) focus the given input, a list's search box, while
 * the component is mounted; without one, `/` focuses the search at the top. The key itself is
 * handled with the other shortcuts (components/shortcuts/keyboard-shortcuts.tsx).
 */
export function useSlashFocus(ref: RefObject<HTMLInputElement | null>): void {
  useEffect(() => registerSlashTarget(ref), [ref]);
}
