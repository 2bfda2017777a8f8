import { PageHeader } from '../../../components/ui/page-header';
import { UsersTable } from '../../../features/users/components/users-table';

export function AdminUsersPage() {
  return (
    <div>
      <PageHeader
        title="Users and roles"
        description="Everyone who has signed in with a plant account. Tick the roles a person needs and save; each change is audited. Operators watch the floor, control engineers own the models, on-call engineers answer alerts, administrators run Shadowloop."
      />
      <UsersTable />
    </div>
  );
}
