import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';

type AuditFilterFormProps = {
  action: string;
  onApply: (action: string) => void;
};

export function AuditFilterForm({ action, onApply }: AuditFilterFormProps) {
  const [draft, setDraft] = useState(action);

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    onApply(draft.trim());
  };

  return (
    <form role="search" aria-label="Filter the audit log" onSubmit={submit} className="flex flex-wrap items-end gap-2">
      <label className="flex flex-col gap-1 text-sm">
        <span className="font-medium">Action</span>
        <input
          value={draft}
          onChange={(event) => setDraft(event.target.value)}
          placeholder="e.g. user.roles.updated"
          className="w-64 rounded-sm border border-ink/40 bg-panel px-2 py-1.5"
        />
      </label>
      <Button type="submit" variant="primary">
        Apply filter
      </Button>
      {action ? (
        <Button
          variant="quiet"
          onClick={() => {
            setDraft('');
            onApply('');
          }}
        >
          Show all actions
        </Button>
      ) : null}
    </form>
  );
}
