import { describeError } from '../../../../components/errors/describe-error';
import { isApiError } from '../../../../lib/api';

const FOUR_EYES =
  'Shadowloop asks a second control engineer to approve every model version: the one who wrote it cannot approve it. Ask a colleague with the control engineer role to review it.';

/** Why a review step was refused, with the four-eyes rule spelled out when that is the reason. */
export function ActionError({ error }: { error: unknown }) {
  if (!error) return null;
  const described = describeError(error);
  const fourEyes = isApiError(error) && error.status === 403 && /own|author|four/i.test(error.message);
  return (
    <p role="alert" className="rounded-sm border-l-4 border-l-diverged bg-panel px-3 py-2 text-sm">
      <strong>{fourEyes ? 'You cannot approve your own version.' : described.title + '.'}</strong>{' '}
      {fourEyes ? FOUR_EYES : `${described.explanation} ${described.nextStep}`}
    </p>
  );
}

export function FourEyesNotice({ authorName }: { authorName: string }) {
  return (
    <div className="rounded-sm border border-rule border-l-4 border-l-twin bg-panel px-4 py-3 text-sm">
      <p className="font-bold">Waiting for another engineer&apos;s review</p>
      <p className="mt-1">
        You ({authorName}) wrote this version, so you cannot approve or reject it. {FOUR_EYES} They will find it under
        Models, waiting for review.
      </p>
    </div>
  );
}
