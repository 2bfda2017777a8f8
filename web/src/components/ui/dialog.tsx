import { useEffect, useId, useRef, type ReactNode } from 'react';

type DialogProps = {
  title: string;
  onClose: () => void;
  children: ReactNode;
};

const FOCUSABLE =
  'a[href], button:not([disabled]), input:not([disabled]), select:not([disabled]), textarea:not([disabled]), [tabindex]:not([tabindex="-1"])';

/**
 * Tab and Shift+Tab go round the panel's own controls (WAI-ARIA modal dialog pattern): focus never
 * wanders to the page behind the dialog.
 */
/**
 * The controls Tab stops at: not hidden, and of a group of radio buttons only the checked one (or
 * every one while none is checked, as browsers do).
 */
function tabStops(panel: HTMLElement): HTMLElement[] {
  const radios = [...panel.querySelectorAll<HTMLInputElement>('input[type="radio"]')];
  return [...panel.querySelectorAll<HTMLElement>(FOCUSABLE)].filter((el) => {
    if (el.closest('[hidden], [inert]')) return false;
    if (!(el instanceof HTMLInputElement)) return true;
    if (el.type === 'hidden') return false;
    return el.type !== 'radio' || el.checked || !radios.some((r) => r.name === el.name && r.checked);
  });
}

function keepFocusInside(panel: HTMLElement, event: KeyboardEvent): void {
  const focusable = tabStops(panel);
  if (focusable.length === 0) {
    event.preventDefault();
    panel.focus();
    return;
  }
  const first = focusable[0];
  const last = focusable[focusable.length - 1];
  const active = document.activeElement;
  const outside = !panel.contains(active) || active === panel;
  if (event.shiftKey && (outside || active === first)) {
    event.preventDefault();
    last.focus();
  } else if (!event.shiftKey && (outside || active === last)) {
    event.preventDefault();
    first.focus();
  }
}

/** A modal panel: focus moves in when it opens, stays inside while it is open, and Escape closes it. */
export function Dialog({ title, onClose, children }: DialogProps) {
  const titleId = useId();
  const panelRef = useRef<HTMLDivElement>(null);
  const closeRef = useRef(onClose);

  useEffect(() => {
    closeRef.current = onClose;
  }, [onClose]);

  useEffect(() => {
    const previous = document.activeElement as HTMLElement | null;
    panelRef.current?.focus();
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key === 'Escape') closeRef.current();
      else if (event.key === 'Tab' && panelRef.current) keepFocusInside(panelRef.current, event);
    };
    document.addEventListener('keydown', onKeyDown);
    return () => {
      document.removeEventListener('keydown', onKeyDown);
      previous?.focus();
    };
  }, []);

  return (
    <div className="fixed inset-0 z-40 flex items-start justify-center overflow-y-auto bg-ink/40 px-4 py-12">
      <div
        ref={panelRef}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        tabIndex={-1}
        className="w-full max-w-xl rounded-sm border border-rule border-t-4 border-t-twin bg-panel p-5 text-sm shadow-lg focus:outline-none"
      >
        <h2 id={titleId} className="text-lg font-bold">
          {title}
        </h2>
        <div className="mt-3 space-y-3">{children}</div>
      </div>
    </div>
  );
}
