import { useEffect, useRef, useState } from 'react';
import { Link, matchPath, useLocation, useNavigate } from 'react-router';
import type { Role } from '@lotwise/shared';
import { ShortcutList } from './shortcut-list';
import { Dialog } from '../ui/dialog';
import { paths } from '../../config/paths';
import { withQuery } from '../../lib/api-client';
import {
  drawField,
  focusGlobalSearch,
  isTypingTarget,
  matchKeys,
  shortcutsFor,
  slashTarget,
  type ShortcutId,
} from '../../lib/shortcuts';

/** How long the first key of a two-key shortcut (`g`) waits for the second. */
const sequenceMs = 1500;

export const drawSearchHint =
  'Find a container to draw from: type its label code or a chemical, or scan its label.';

/** Where `r` opens a run: for the plan or procedure on screen, else the empty run form. */
export function runStartFor(pathname: string): string {
  const id = (pattern: string) => {
    const value = matchPath(pattern, pathname)?.params.id;
    return value && /^\d+$/.test(value) ? Number(value) : undefined;
  };
  const planId = id(paths.plan());
  if (planId) return withQuery(paths.runNew, { planId });
  const procedureId = id(paths.procedure());
  if (procedureId) return withQuery(paths.runNew, { procedureId });
  return paths.runNew;
}

/**
 * The keyboard shortcuts of every signed-in page (lib/shortcuts.ts lists them) and their
 * overlay, opened with `?`. Keys typed into a field or an open dialog are left alone.
 */
export function KeyboardShortcuts({ role }: { role: Role }) {
  const navigate = useNavigate();
  const location = useLocation();
  const [open, setOpen] = useState(false);
  const opener = useRef<HTMLElement | null>(null);
  const pathname = location.pathname;
  const available = shortcutsFor(role);

  useEffect(() => {
    const active = shortcutsFor(role);
    let pending: string[] = [];
    let timer: ReturnType<typeof setTimeout> | undefined;

    function run(id: ShortcutId) {
      switch (id) {
        case 'search': {
          const input = slashTarget();
          if (input) input.focus();
          else focusGlobalSearch();
          return;
        }
        case 'draw': {
          const field = drawField();
          if (field) {
            field.scrollIntoView?.({ block: 'center' });
            field.focus();
          } else focusGlobalSearch(drawSearchHint);
          return;
        }
        case 'run':
          return void navigate(runStartFor(pathname));
        case 'home':
          return void navigate(paths.home);
        case 'stock':
          return void navigate(paths.stock);
        case 'help':
          opener.current =
            document.activeElement instanceof HTMLElement ? document.activeElement : null;
          setOpen(true);
          return;
      }
    }

    function handleKeyDown(event: KeyboardEvent) {
      if (event.defaultPrevented || event.ctrlKey || event.metaKey || event.altKey) return;
      if (event.key.length !== 1 || isTypingTarget(event.target)) return;
      clearTimeout(timer);
      let pressed = [...pending, event.key];
      let match = matchKeys(active, pressed);
      if (match === null && pending.length > 0) {
        pressed = [event.key];
        match = matchKeys(active, pressed);
      }
      pending = [];
      if (match === null) return;
      event.preventDefault();
      if (match === 'partial') {
        pending = pressed;
        timer = setTimeout(() => (pending = []), sequenceMs);
        return;
      }
      run(match.shortcut.id);
    }

    document.addEventListener('keydown', handleKeyDown);
    // This part loads just after the first page shows: the mark says the keys are listened to.
    document.body.dataset.shortcuts = 'on';
    return () => {
      clearTimeout(timer);
      document.removeEventListener('keydown', handleKeyDown);
      delete document.body.dataset.shortcuts;
    };
  }, [navigate, role, pathname]);

  function close() {
    setOpen(false);
    // Back to where the person was (the dialog itself had the focus).
    const back = opener.current;
    opener.current = null;
    requestAnimationFrame(() => (back?.isConnected ? back.focus() : undefined));
  }

  return (
    <Dialog
      open={open}
      onClose={close}
      title="Keyboard shortcuts"
      description="Press a key anywhere outside a text field."
      footer={
        <Link
          to={paths.help}
          onClick={() => setOpen(false)}
          className="rounded text-sm font-medium text-accent-700 underline-offset-2 hover:underline"
        >
          More on the help page
        </Link>
      }
    >
      <ShortcutList items={available} />
    </Dialog>
  );
}
