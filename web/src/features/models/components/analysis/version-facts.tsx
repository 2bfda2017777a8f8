import { formatInTimeZone } from '../../../../lib/format-time';
import type { Version } from '../../types';

type Person = { name: string; email: string } | null;

const who = (person: Person) => (person ? person.name || person.email : '—');

/** Who did what to the version and when, in the plant's time zone. */
export function VersionFacts({ version, timeZone }: { version: Version; timeZone: string }) {
  const at = (iso: string | null) => formatInTimeZone(iso, timeZone);
  const rows: [string, string][] = [
    ['Written by', `${who(version.author)}, ${at(version.createdAt)}`],
    ['What changed', version.changeNote],
  ];
  if (version.submittedAt) rows.push(['Submitted for review', at(version.submittedAt)]);
  if (version.justification) rows.push(['Reason it may run although not stable', version.justification]);
  if (version.reviewer)
    rows.push([
      version.status === 'rejected' ? 'Rejected by' : 'Approved by',
      `${who(version.reviewer)}, ${at(version.reviewedAt)}`,
    ]);
  if (version.reviewNote) rows.push(['Review note', version.reviewNote]);
  if (version.rejectReason) rows.push(['Reason for rejecting', version.rejectReason]);
  if (version.activatedAt)
    rows.push([
      'Activated',
      `${at(version.activatedAt)}${version.activatedBy ? ` by ${who(version.activatedBy)}` : ''}`,
    ]);
  if (version.retiredAt) rows.push(['Retired', at(version.retiredAt)]);
  return (
    <dl className="grid max-w-4xl grid-cols-[minmax(8rem,14rem)_1fr] gap-x-4 gap-y-1 text-sm">
      {rows.map(([term, detail]) => (
        <div key={term} className="contents">
          <dt className="font-medium">{term}</dt>
          <dd className="whitespace-pre-line">{detail}</dd>
        </div>
      ))}
    </dl>
  );
}
