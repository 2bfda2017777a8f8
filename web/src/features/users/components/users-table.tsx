import { useQuery } from '@tanstack/react-query';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { SkeletonRows, Table, Td, Th } from '../../../components/ui/table';
import { ROLE_LABELS, ROLES } from '../../session/roles';
import { usersQueryOptions } from '../api/get-users';
import { UserRolesRow } from './user-roles-row';

const COLUMN_COUNT = ROLES.length + 3;

export function UsersTable() {
  const users = useQuery(usersQueryOptions());

  if (users.isError) return <ErrorNotice error={users.error} onRetry={() => void users.refetch()} />;
  return (
    <Table caption="Users and their roles">
      <thead>
        <tr>
          <Th>User</Th>
          {ROLES.map((role) => (
            <Th key={role} className="text-center">
              {ROLE_LABELS[role]}
            </Th>
          ))}
          <Th>Last sign-in</Th>
          <Th>
            <span className="sr-only">Actions</span>
          </Th>
        </tr>
      </thead>
      <tbody>
        {users.isPending ? <SkeletonRows columns={COLUMN_COUNT} /> : null}
        {users.data?.length === 0 ? (
          <tr>
            <Td colSpan={COLUMN_COUNT} className="py-4 text-ink/75">
              No users yet. A person appears here after their first sign-in with their plant account.
            </Td>
          </tr>
        ) : null}
        {users.data?.map((user) => (
          <UserRolesRow key={`${user.id}:${user.roles.join(',')}`} user={user} />
        ))}
      </tbody>
    </Table>
  );
}
