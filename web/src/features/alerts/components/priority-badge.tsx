import type { Priority } from '@shadowloop/api/contracts';
import { PRIORITY_WORDS } from '../utils/alert-words';

/** Filled notches, three for the most urgent: the shape and the word say the priority, not a colour. */
function Notches({ priority }: { priority: Priority }) {
  const filled = 4 - priority;
  return (
    <svg width="14" height="12" viewBox="0 0 14 12" aria-hidden="true" focusable="false">
      {[0, 1, 2].map((i) => (
        <path
          key={i}
          d={`M${1 + i * 4.5} 11 L${3 + i * 4.5} ${7 - i * 3} L${5 + i * 4.5} 11 Z`}
          fill={i < filled ? 'currentColor' : 'none'}
          stroke="currentColor"
          strokeWidth="1"
        />
      ))}
    </svg>
  );
}

export function PriorityBadge({ priority }: { priority: Priority }) {
  return (
    <span
      className={`inline-flex items-center gap-1 whitespace-nowrap rounded-sm border px-1.5 py-0.5 text-xs font-bold tabular-nums ${
        priority === 1 ? 'border-ink bg-ink text-paper' : 'border-ink/40 bg-panel text-ink'
      }`}
    >
      <Notches priority={priority} />P{priority} {PRIORITY_WORDS[priority]}
    </span>
  );
}
