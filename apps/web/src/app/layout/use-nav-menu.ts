import {
  useEffect,
  useId,
  useRef,
  useState,
  type KeyboardEvent,
  type MouseEvent,
  type RefObject,
} from 'react';
import { useLocation } from 'react-router';

export interface NavMenu {
  open: boolean;
  buttonRef: RefObject<HTMLButtonElement | null>;
  panelRef: RefObject<HTMLElement | null>;
  panelId: string;
  toggle: () => void;
  /** Closes the menu and gives focus back to the button that opened it. */
  close: () => void;
  /** Escape closes; a followed link closes. */
  panelHandlers: {
    onKeyDown: (event: KeyboardEvent<HTMLElement>) => void;
    onClick: (event: MouseEvent<HTMLElement>) => void;
  };
}

/**
 * The menu behind one button on a phone: opening moves focus to its first entry, Escape or the
 * button closes it and returns focus to the button, and moving to another page closes it (it is
 * open only on the page it was opened on).
 */
export function useNavMenu(): NavMenu {
  const { pathname } = useLocation();
  const [openOn, setOpenOn] = useState<string | null>(null);
  const open = openOn === pathname;
  const buttonRef = useRef<HTMLButtonElement>(null);
  const panelRef = useRef<HTMLElement>(null);
  const panelId = useId();

  useEffect(() => {
    if (open) panelRef.current?.querySelector<HTMLElement>('a[href], button')?.focus();
  }, [open]);

  function close() {
    setOpenOn(null);
    buttonRef.current?.focus();
  }

  return {
    open,
    buttonRef,
    panelRef,
    panelId,
    toggle: () => (open ? close() : setOpenOn(pathname)),
    close,
    panelHandlers: {
      onKeyDown: (event) => {
        if (open && event.key === 'Escape') {
          event.stopPropagation();
          close();
        }
      },
      onClick: (event) => {
        if (open && (event.target as Element).closest('a[href]')) setOpenOn(null);
      },
    },
  };
}
