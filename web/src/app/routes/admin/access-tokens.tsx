import { PageHeader } from '../../../components/ui/page-header';
import { AccessTokenTable } from '../../../features/access-tokens/components/access-token-table';

export function AdminAccessTokensPage() {
  return (
    <div>
      <PageHeader
        title="Access tokens of all users"
        description="Every access token in Shadowloop, with its owner and when it was last used. Revoke a token that is lost, unused or belongs to someone who has left; scripts using it stop at once."
      />
      <AccessTokenTable scope="all" />
    </div>
  );
}
