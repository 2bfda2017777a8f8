import type { AlertEvent } from '@shadowloop/api/contracts';
import { formatPlantTime } from '../../../lib/plant-time';
import { ALERT_STATE_WORDS, EVENT_WORDS } from '../utils/alert-words';
import { eventDetailWords } from '../utils/event-details';

function StateChange({ event }: { event: AlertEvent }) {
  if (!event.toState || event.fromState === event.toState) return null;
  return (
    <span className="text-ink/80">
      {event.fromState ? `${ALERT_STATE_WORDS[event.fromState]} → ` : ''}
      {ALERT_STATE_WORDS[event.toState]}
    </span>
  );
}

/** What happened to the alert, oldest first: who, when, the note, and the state it moved to. */
export function AlertTimeline({ events, timeZone }: { events: AlertEvent[]; timeZone: string }) {
  if (events.length === 0) return <p className="text-sm text-ink/75">Nothing has happened to this alert yet.</p>;
  const ordered = [...events].sort((a, b) => Date.parse(a.at) - Date.parse(b.at) || a.id - b.id);
  return (
    <ol aria-label="Timeline" className="space-y-0 border-l-2 border-rule pl-4 text-sm">
      {ordered.map((event) => {
        const details = eventDetailWords(event, timeZone);
        return (
          <li key={event.id} className="relative pb-3">
            <span
              aria-hidden="true"
              className="absolute -left-[1.4rem] top-1.5 size-2.5 rounded-full border-2 border-ink bg-panel"
            />
            <p className="flex flex-wrap gap-x-3">
              <span className="tabular-nums text-ink/75">
                {formatPlantTime(Date.parse(event.at), timeZone, { date: true })}
              </span>
              <span className="font-bold">{EVENT_WORDS[event.kind]}</span>
              <span>{event.actor ? `by ${event.actor.name}` : 'by Shadowloop'}</span>
              <StateChange event={event} />
            </p>
            {event.note ? <p className="mt-0.5 whitespace-pre-line">“{event.note}”</p> : null}
            {details ? <p className="mt-0.5 text-xs text-ink/70">{details}</p> : null}
          </li>
        );
      })}
    </ol>
  );
}
