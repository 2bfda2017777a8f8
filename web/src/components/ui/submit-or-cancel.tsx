import { Button } from './button';

/** The foot of a form: its submit button (disabled while the request runs) and Cancel. */
export function SubmitOrCancel({
  label,
  pending,
  onCancel,
}: {
  label: string;
  pending: boolean;
  onCancel: () => void;
}) {
  return (
    <div className="flex gap-2">
      <Button type="submit" variant="primary" disabled={pending}>
        {label}
      </Button>
      <Button variant="quiet" onClick={onCancel}>
        Cancel
      </Button>
    </div>
  );
}
