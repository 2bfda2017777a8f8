import { useCallback, useEffect, useId, useRef, useState } from 'react';
import { Link } from 'react-router';
import { useSignOut } from '../../features/session/api/sign-out';
import { ROLE_LABELS, type SignedInUser } from '../../features/session/roles';
import { describeError } from '../errors/describe-error';
import { Button } from '../ui/button';

function useCloseOnOutsideOrEscape(open: boolean, close: () => void) {
  const containerRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!open) return;
    const onPointerDown = (event: PointerEvent) => {
      if (!containerRef.current?.contains(event.target as Node)) close();
    };
    const onKeyDown = (event: KeyboardEvent) => {
      if (event.key === 'Escape') close();
    };
    document.addEventListener('pointerdown', onPointerDown);
    document.addEventListener('keydown', onKeyDown);
    return () => {
      document.removeEventListener('pointerdown', onPointerDown);
      document.removeEventListener('keydown', onKeyDown);
    };
  }, [open, close]);
  return containerRef;
}

export function UserMenu({ user }: { user: SignedInUser }) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const close = useCallback(() => setOpen(false), []);
  const containerRef = useCloseOnOutsideOrEscape(open, close);
  const signOut = useSignOut();

  return (
    <div ref={containerRef} className="relative">
      <button
        type="button"
        aria-label="User menu"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((wasOpen) => !wasOpen)}
        className="flex items-center gap-1.5 rounded-sm border border-rule px-2 py-1 text-sm hover:border-ink/50 focus-visible:outline-2 focus-visible:outline-twin"
      >
        <span className="max-w-40 truncate font-medium">{user.name}</span>
        <span aria-hidden="true">▾</span>
      </button>
      {open ? (
        <div
          id={panelId}
          className="absolute right-0 top-full z-30 mt-1 w-64 rounded-sm border border-rule bg-panel p-3 text-sm shadow-md"
        >
          <p className="font-bold">{user.name}</p>
          <p className="truncate text-ink/75">{user.email}</p>
          <p className="mt-2 text-xs font-bold uppercase tracking-wide text-ink/70">Roles</p>
          <ul className="mb-3">
            {user.roles.map((role) => (
              <li key={role}>{ROLE_LABELS[role] ?? role}</li>
            ))}
          </ul>
          <div className="flex flex-col items-start gap-2 border-t border-rule pt-2">
            <Link to="/tokens" className="font-medium underline" onClick={() => setOpen(false)}>
              Access tokens
            </Link>
            <Button onClick={() => signOut.mutate()} disabled={signOut.isPending}>
              Sign out
            </Button>
            {signOut.isError ? <p role="alert">{describeError(signOut.error).explanation}</p> : null}
          </div>
        </div>
      ) : null}
    </div>
  );
}
