import { useState } from 'react';
import { describeError } from '../../../components/errors/describe-error';
import { Button } from '../../../components/ui/button';
import { Td } from '../../../components/ui/table';
import { usePlantTimestamp } from '../../alerts/hooks/use-plant-time-zone';
import { ROLE_LABELS, ROLES, type Role } from '../../session/roles';
import { useUpdateUserRoles } from '../api/update-user-roles';
import type { UserAccount } from '../api/get-users';

function sameRoles(a: readonly Role[], b: readonly Role[]): boolean {
  return a.length === b.length && a.every((role) => b.includes(role));
}

export function UserRolesRow({ user }: { user: UserAccount }) {
  const formatTimestamp = usePlantTimestamp();
  const [selected, setSelected] = useState<Role[]>(user.roles);
  const update = useUpdateUserRoles();
  const changed = !sameRoles(selected, user.roles);

  const toggle = (role: Role, checked: boolean) => {
    update.reset();
    setSelected((current) =>
      checked ? ROLES.filter((r) => r === role || current.includes(r)) : current.filter((r) => r !== role),
    );
  };

  return (
    <tr>
      <Td>
        <div className="font-medium">{user.name}</div>
        <div className="text-ink/75">{user.email}</div>
      </Td>
      {ROLES.map((role) => (
        <Td key={role} className="text-center">
          <input
            type="checkbox"
            className="size-4 accent-ink"
            aria-label={`${ROLE_LABELS[role]} role for ${user.email}`}
            checked={selected.includes(role)}
            onChange={(event) => toggle(role, event.target.checked)}
          />
        </Td>
      ))}
      <Td className="tabular-nums">{formatTimestamp(user.lastSignInAt)}</Td>
      <Td>
        <div className="flex gap-2">
          <Button
            variant="primary"
            disabled={!changed || update.isPending}
            aria-label={`Save roles for ${user.email}`}
            onClick={() => update.mutate({ userId: user.id, roles: selected })}
          >
            {update.isPending ? 'Saving…' : 'Save'}
          </Button>
          {changed ? (
            <Button variant="quiet" onClick={() => setSelected(user.roles)}>
              Undo
            </Button>
          ) : null}
        </div>
        {update.isError ? (
          <p role="alert" className="mt-1 max-w-56 text-xs text-diverged">
            Not saved: {describeError(update.error).explanation}
          </p>
        ) : null}
      </Td>
    </tr>
  );
}
