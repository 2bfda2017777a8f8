import { useQuery } from '@tanstack/react-query';
import { ErrorNotice } from '../../../components/errors/error-notice';
import { SkeletonRows, Table, Td, Th } from '../../../components/ui/table';
import { usePlantTimestamp } from '../../alerts/hooks/use-plant-time-zone';
import { accessTokensQueryOptions, type AccessToken, type AccessTokenScope } from '../api/get-access-tokens';
import { RevokeTokenButton } from './revoke-token-button';

function TokenRow({ token, showOwner }: { token: AccessToken; showOwner: boolean }) {
  const formatTimestamp = usePlantTimestamp();
  return (
    <tr className={token.revokedAt ? 'text-ink/60' : undefined}>
      {showOwner ? <Td>{token.userEmail ?? '—'}</Td> : null}
      <Td className="font-medium">{token.label}</Td>
      <Td>
        <code>{token.prefix}…</code>
      </Td>
      <Td className="tabular-nums">{formatTimestamp(token.createdAt)}</Td>
      <Td className="tabular-nums">{token.lastUsedAt ? formatTimestamp(token.lastUsedAt) : 'never'}</Td>
      <Td>{token.revokedAt ? `Revoked ${formatTimestamp(token.revokedAt)}` : 'Active'}</Td>
      <Td>
        <RevokeTokenButton token={token} />
      </Td>
    </tr>
  );
}

export function AccessTokenTable({ scope }: { scope: AccessTokenScope }) {
  const tokens = useQuery(accessTokensQueryOptions(scope));
  const showOwner = scope === 'all';
  const headings = [...(showOwner ? ['Owner'] : []), 'Label', 'Starts with', 'Created', 'Last used', 'State', ''];

  if (tokens.isError) return <ErrorNotice error={tokens.error} onRetry={() => void tokens.refetch()} />;
  return (
    <Table caption={showOwner ? 'Access tokens of every user' : 'Your access tokens'}>
      <thead>
        <tr>
          {headings.map((heading, index) => (
            <Th key={index}>{heading || <span className="sr-only">Actions</span>}</Th>
          ))}
        </tr>
      </thead>
      <tbody>
        {tokens.isPending ? <SkeletonRows columns={headings.length} /> : null}
        {tokens.data?.length === 0 ? (
          <tr>
            <Td colSpan={headings.length} className="py-4 text-ink/75">
              {showOwner
                ? 'No access tokens exist yet. Users create their own under Access tokens in the user menu.'
                : 'You have no access tokens yet. Create one above for a script or a plant bridge.'}
            </Td>
          </tr>
        ) : null}
        {tokens.data?.map((token) => (
          <TokenRow key={token.id} token={token} showOwner={showOwner} />
        ))}
      </tbody>
    </Table>
  );
}
