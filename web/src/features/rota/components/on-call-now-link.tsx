import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router';
import { onCallNowQueryOptions } from '../api/get-oncall-now';

function onCallName(data: { primary: { name: string } | null } | undefined, failed: boolean): string {
  if (failed) return 'not known right now';
  if (!data) return '…';
  return data.primary?.name ?? 'nobody';
}

/** "On call now: <primary>", from the rota; a link to it. */
export function OnCallNowLink() {
  const now = useQuery(onCallNowQueryOptions());
  const name = onCallName(now.data, now.isError && !now.data);
  return (
    <Link to="/rota" className="text-sm hover:underline" title="The rota: who is on call and when">
      On call now: <span className={now.data?.primary ? 'font-bold' : 'text-ink/75'}>{name}</span>
    </Link>
  );
}
