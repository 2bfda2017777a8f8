import { useSearchParams } from 'react-router';
import { Button } from '../../../components/ui/button';

/** What the e-mail's one-click link did, as the link's redirect reports it in `?ack=`. */
export const ACK_LINK_OUTCOMES = {
  done: {
    tone: 'in_step',
    text: 'The alert is acknowledged. Escalation to the next person on the rota has stopped.',
  },
  used: {
    tone: 'drifting',
    text: 'That acknowledge link was used already and works only once. The timeline shows who acknowledged the alert and when.',
  },
  already: {
    tone: 'drifting',
    text: 'Nothing was left to acknowledge: the alert had been acknowledged, shelved or closed already. The timeline shows who did it and when.',
  },
  expired: {
    tone: 'drifting',
    text: 'That acknowledge link has expired. If the alert still waits, acknowledge it here instead.',
  },
  forbidden: {
    tone: 'diverged',
    text: 'Your account cannot acknowledge alerts: that needs the on-call role. Ask an administrator if you should have it.',
  },
  someone_else: {
    tone: 'drifting',
    text: 'That acknowledge link was sent to someone else and works only for them. If you are handling the alert, acknowledge it here.',
  },
  invalid: {
    tone: 'diverged',
    text: 'That acknowledge link is not valid: it may have been cut short or changed. Find the alert here and acknowledge it in the app.',
  },
} as const;

export type AckLinkOutcome = keyof typeof ACK_LINK_OUTCOMES;

const BORDER = { in_step: 'border-l-in-step', drifting: 'border-l-drifting', diverged: 'border-l-diverged' } as const;

export function AckLinkBanner() {
  const [params, setParams] = useSearchParams();
  const outcome = params.get('ack');
  if (!outcome || !(outcome in ACK_LINK_OUTCOMES)) return null;
  const { tone, text } = ACK_LINK_OUTCOMES[outcome as AckLinkOutcome];
  const dismiss = () => {
    const next = new URLSearchParams(params);
    next.delete('ack');
    setParams(next, { replace: true });
  };
  return (
    <div
      role="status"
      aria-label="Acknowledge link"
      className={`mb-4 flex flex-wrap items-center gap-3 rounded-sm border border-rule border-l-4 bg-panel px-4 py-2 text-sm ${BORDER[tone]}`}
    >
      <p className="flex-1">{text}</p>
      <Button variant="quiet" onClick={dismiss}>
        Dismiss
      </Button>
    </div>
  );
}
