import { useState } from 'react';
import { Button } from './button';

type NewTokenNoticeProps = {
  created: { label: string; token: string };
  /** Who can do what with it; a personal token acts with its owner's roles. */
  reach?: string;
  onDismiss: () => void;
};

/** A secret shown exactly once, with a copy button and the warning that it will not come back. */
export function NewTokenNotice({
  created,
  reach = 'Anyone holding it acts with your roles.',
  onDismiss,
}: NewTokenNoticeProps) {
  const [copyState, setCopyState] = useState<'idle' | 'copied' | 'failed'>('idle');

  const copy = async () => {
    try {
      await navigator.clipboard.writeText(created.token);
      setCopyState('copied');
    } catch {
      setCopyState('failed');
    }
  };

  return (
    <section
      aria-label="New access token"
      className="space-y-2 rounded-sm border border-drifting/60 border-l-4 border-l-drifting bg-panel px-4 py-3 text-sm"
    >
      <h2 className="font-bold">Token “{created.label}” created</h2>
      <p role="note" className="font-medium">
        Copy it now: Shadowloop will not show this token again. {reach}
      </p>
      <div className="flex flex-wrap items-center gap-2">
        <input
          readOnly
          aria-label="New token value"
          value={created.token}
          onFocus={(event) => event.currentTarget.select()}
          className="min-w-0 flex-1 rounded-sm border border-rule bg-paper px-2 py-1 font-mono text-xs"
        />
        <Button variant="primary" onClick={() => void copy()}>
          Copy token
        </Button>
        <Button variant="quiet" onClick={onDismiss}>
          I have copied it
        </Button>
      </div>
      <p aria-live="polite" className="text-xs">
        {copyState === 'copied' ? 'Copied to the clipboard.' : null}
        {copyState === 'failed' ? 'The browser refused to copy: select the token and copy it by hand.' : null}
      </p>
    </section>
  );
}
