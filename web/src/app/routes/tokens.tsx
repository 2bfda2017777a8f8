import { PageHeader } from '../../components/ui/page-header';
import { AccessTokenTable } from '../../features/access-tokens/components/access-token-table';
import { CreateAccessTokenForm } from '../../features/access-tokens/components/create-access-token-form';

export function MyAccessTokensPage() {
  return (
    <div className="space-y-5">
      <PageHeader
        title="My access tokens"
        description="Tokens let scripts and plant bridges call the Shadowloop API as you, with your roles: send one as “Authorization: Bearer <token>”. Revoke a token as soon as it is no longer needed."
      />
      <section className="space-y-2">
        <h2 className="text-base font-bold">Create a token</h2>
        <CreateAccessTokenForm />
      </section>
      <section className="space-y-2">
        <h2 className="text-base font-bold">Your tokens</h2>
        <AccessTokenTable scope="mine" />
      </section>
    </div>
  );
}
