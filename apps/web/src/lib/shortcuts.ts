import { useSyncExternalStore, type RefObject } from 'react';
import { can, type Permission, type Role } from '@lotwise/shared';

export type ShortcutId = 'search' | 'draw' | 'run' | 'home' | 'stock' | 'help';

export interface Shortcut {
  id: ShortcutId;
  /** The keys pressed one after the other, e.g. `['g', 's']`. */
  keys: readonly string[];
  label: string;
  /** What it does, in a sentence. */
  detail: string;
  /** Shown and active only for roles holding it. */
  permission?: Permission;
}

/** Every keyboard shortcut of Lotwise: the overlay (`?`), the help page and the handler read this. */
export const shortcuts: readonly Shortcut[] = [
  {
    id: 'search',
    keys: ['/'],
    label: 'Search',
    detail: 'Puts the cursor in the list’s own search box, or in the search at the top.',
  },
  {
    id: 'draw',
    keys: ['d'],
    label: 'Record a draw',
    detail:
      'On a container’s page: goes to its draw form. Elsewhere: the search at the top, to find the container first.',
    permission: 'stock.draw',
  },
  {
    id: 'run',
    keys: ['r'],
    label: 'Record a run',
    detail: 'Opens a new run — of the plan or procedure on screen, if there is one.',
    permission: 'runs.record',
  },
  { id: 'home', keys: ['g', 'h'], label: 'Go to the start page', detail: 'Press g, then h.' },
  {
    id: 'stock',
    keys: ['g', 's'],
    label: 'Go to stock',
    detail: 'Press g, then s.',
    permission: 'stock.read',
  },
  { id: 'help', keys: ['?'], label: 'Show the keyboard shortcuts', detail: 'This list.' },
];

/** The shortcuts a role may use. */
export function shortcutsFor(role: Role): Shortcut[] {
  return shortcuts.filter((shortcut) => !shortcut.permission || can(role, shortcut.permission));
}

/** How a key is written on screen (and read aloud). */
export function keyName(key: string): string {
  return key === '/' ? 'slash' : key === '?' ? 'question mark' : key;
}

/** The result of the keys pressed so far: a shortcut, the start of one, or nothing. */
export function matchKeys(
  available: readonly Shortcut[],
  pressed: readonly string[],
): { shortcut: Shortcut } | 'partial' | null {
  const exact = available.find(
    (shortcut) =>
      shortcut.keys.length === pressed.length && shortcut.keys.every((k, i) => k === pressed[i]),
  );
  if (exact) return { shortcut: exact };
  const starts = available.some(
    (shortcut) =>
      shortcut.keys.length > pressed.length && pressed.every((k, i) => shortcut.keys[i] === k),
  );
  return starts ? 'partial' : null;
}

/**
 * Whether a key press belongs to what the person is typing or to an open dialog (then
 * shortcuts stay out of the way).
 */
export function isTypingTarget(target: EventTarget | null): boolean {
  return (
    target instanceof Element &&
    target.closest(
      'input, textarea, select, [contenteditable=""], [contenteditable="true"], dialog[open]',
    ) !== null
  );
}

/** Marks the element whose fields `d` focuses (the draw form of a container). */
export const drawTargetProps = { 'data-shortcut-target': 'draw' } as const;

/** The draw form's first field on the page, if a container's draw form is shown. */
export function drawField(root: ParentNode = document): HTMLElement | null {
  const form = root.querySelector('[data-shortcut-target="draw"]');
  return (
    form?.querySelector<HTMLElement>(
      'input:not([type="radio"]):not([type="hidden"]):not([disabled]), select:not([disabled]), textarea:not([disabled])',
    ) ?? null
  );
}

// The list search boxes registered by pages (useSlashFocus); `/` focuses the latest.
const slashTargets: RefObject<HTMLInputElement | null>[] = [];

/** A page's own search box for `/` while it is mounted; answers the unregister function. */
export function registerSlashTarget(ref: RefObject<HTMLInputElement | null>): () => void {
  slashTargets.push(ref);
  return () => {
    const index = slashTargets.lastIndexOf(ref);
    if (index >= 0) slashTargets.splice(index, 1);
  };
}

/** The page's search box `/` should focus, or null for the search at the top. */
export function slashTarget(): HTMLInputElement | null {
  for (let i = slashTargets.length - 1; i >= 0; i--) {
    const input = slashTargets[i]!.current;
    if (input?.isConnected) return input;
  }
  return null;
}

/** The id of the search at the top of every signed-in page. */
export const globalSearchId = 'global-search';

// A line the search at the top shows while it has focus, e.g. why `d` put the cursor there.
let searchHint: string | null = null;
const hintListeners = new Set<() => void>();

function setSearchHint(hint: string | null) {
  searchHint = hint;
  for (const listener of hintListeners) listener();
}

/** Focuses the search at the top, with a line saying what to look for. */
export function focusGlobalSearch(hint: string | null = null): boolean {
  const input = document.getElementById(globalSearchId);
  if (!(input instanceof HTMLInputElement)) return false;
  setSearchHint(hint);
  input.focus();
  return true;
}

/** The hint the search at the top shows (cleared when it loses focus). */
export function useSearchHint(): [hint: string | null, clear: () => void] {
  const hint = useSyncExternalStore(
    (listener) => {
      hintListeners.add(listener);
      return () => hintListeners.delete(listener);
    },
    () => searchHint,
  );
  return [hint, () => setSearchHint(null)];
}
