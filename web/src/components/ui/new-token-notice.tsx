import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import type { CreatedAccessToken } from '../api/create-access-token';

type NewTokenNoticeProps = {
  created: CreatedAccessToken;
  onDismiss: () => void;
};

export function NewTokenNotice({ created, onDismiss }: NewTokenNoticeProps) {
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
        Copy it now: Shadowloop will not show this token again. Anyone holding it acts with your roles.
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
