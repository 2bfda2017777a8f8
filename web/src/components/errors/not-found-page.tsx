import { Link, useLocation } from 'react-router';
import { PageHeader } from '../ui/page-header';

export function NotFoundPage() {
  const { pathname } = useLocation();
  return (
    <div>
      <PageHeader title="Page not found" />
      <div className="max-w-2xl space-y-2 text-sm">
        <p>
          Shadowloop has no page at <code>{pathname}</code>. The link may be old or mistyped.
        </p>
        <p>
          <Link className="font-medium underline" to="/">
            Go to the floor
          </Link>{' '}
          or pick a page from the list on the left.
        </p>
      </div>
    </div>
  );
}
