import { useState } from 'react';
import { Link } from 'react-router';
import { Button, buttonClasses } from '../../../../components/ui/button';
import type { SignedInUser } from '../../../session/roles';
import { exportVersionUrl } from '../../api/export-version';
import type { Version } from '../../types';
import { FourEyesNotice } from './action-error';
import { ActivateDialog } from './activate-dialog';
import { RetireVersion } from './retire-version';
import { ReviewDecision } from './review-decision';
import { SubmitForReview } from './submit-for-review';

type ActionBarProps = {
  version: Version;
  user: SignedInUser;
  loop: { id: string; tag: string; activeVersionNumber: number | null };
};

/** What can be done with this version now, by this person; everything else is explained, not hidden. */
export function VersionActionBar({ version, user, loop }: ActionBarProps) {
  const [activating, setActivating] = useState(false);
  const isAuthor = version.author?.email === user.email;
  let step = null;
  if (version.status === 'draft') step = <SubmitForReview version={version} />;
  if (version.status === 'in_review')
    step = isAuthor ? <FourEyesNotice authorName={user.name} /> : <ReviewDecision version={version} />;
  if (version.status === 'approved') {
    step = (
      <Button variant="primary" onClick={() => setActivating(true)}>
        Activate…
      </Button>
    );
  }
  return (
    <section aria-label="Actions" className="space-y-3 rounded-sm border border-rule bg-panel px-4 py-3">
      {step}
      <div className="flex flex-wrap items-center gap-2 text-sm">
        {version.status === 'active' || version.status === 'approved' ? (
          <RetireVersion version={version} loopTag={loop.tag} />
        ) : null}
        <Link to={`/models/${loop.id}/new?from=${version.id}`} className={buttonClasses('secondary')}>
          New draft from this version
        </Link>
        <Link to={`/models/versions/${version.id}/compare`} className={buttonClasses('secondary')}>
          Compare with another version
        </Link>
        <a href={exportVersionUrl(version.id, 'json')} download className={buttonClasses('quiet')}>
          Export JSON
        </a>
        <a href={exportVersionUrl(version.id, 'csv')} download className={buttonClasses('quiet')}>
          Export CSV
        </a>
      </div>
      {activating ? (
        <ActivateDialog
          version={version}
          loopTag={loop.tag}
          activeNumber={loop.activeVersionNumber}
          onClose={() => setActivating(false)}
        />
      ) : null}
    </section>
  );
}
