import { useState, type FormEvent } from 'react';
import { describeError } from '../../../components/errors/describe-error';
import { Button } from '../../../components/ui/button';
import { useCreateAccessToken, type CreatedAccessToken } from '../api/create-access-token';
import { NewTokenNotice } from '../../../components/ui/new-token-notice';

export function CreateAccessTokenForm() {
  const [label, setLabel] = useState('');
  const [created, setCreated] = useState<CreatedAccessToken | null>(null);
  const create = useCreateAccessToken();

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    create.mutate(label.trim(), {
      onSuccess: (token) => {
        setCreated(token);
        setLabel('');
      },
    });
  };

  return (
    <div className="space-y-3">
      <form onSubmit={submit} className="flex flex-wrap items-end gap-2">
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium">Label</span>
          <input
            value={label}
            onChange={(event) => setLabel(event.target.value)}
            required
            maxLength={80}
            placeholder="e.g. historian bridge, aeration"
            className="w-72 rounded-sm border border-ink/40 bg-panel px-2 py-1.5"
          />
        </label>
        <Button type="submit" variant="primary" disabled={create.isPending || label.trim() === ''}>
          Create token
        </Button>
      </form>
      {create.isError ? (
        <p role="alert" className="text-sm text-diverged">
          {describeError(create.error).explanation}
        </p>
      ) : null}
      {created ? <NewTokenNotice created={created} onDismiss={() => setCreated(null)} /> : null}
    </div>
  );
}
