import { PageHeader } from '../../../components/ui/page-header';
import { DevMailbox } from '../../../features/dev-mail/components/dev-mailbox';

export function AdminDevMailPage() {
  return (
    <div>
      <PageHeader
        title="Development mailbox"
        description="The messages caught by the local development mail server instead of being delivered."
      />
      <DevMailbox />
    </div>
  );
}
