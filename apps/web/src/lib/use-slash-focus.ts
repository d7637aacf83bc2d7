import { useEffect, type RefObject } from 'react';

/** Pressing `/` anywhere outside a text field focuses the given input (list search boxes). */
export function useSlashFocus(ref: RefObject<HTMLInputElement | null>): void {
  useEffect(() => {
    function handleKeyDown(event: KeyboardEvent) {
      if (event.key !== '/' || event.ctrlKey || event.metaKey || event.altKey) return;
      const target = event.target;
      const typing =
        target instanceof Element &&
        target.closest('input, textarea, select, [contenteditable="true"], dialog[open]') !== null;
      if (typing) return;
      event.preventDefault();
      ref.current?.focus();
    }
    document.addEventListener('keydown', handleKeyDown);
    return () => document.removeEventListener('keydown', handleKeyDown);
  }, [ref]);
}
