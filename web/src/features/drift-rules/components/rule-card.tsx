import type { DriftRuleKind } from '@shadowloop/api/contracts';
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { StatusWord } from '../../../components/ui/status-word';
import { formatPlantTime } from '../../../lib/plant-time';
import { PriorityBadge } from '../../alerts/components/priority-badge';
import type { Loop } from '../../loops/api/get-loops';
import type { DriftRule } from '../api/get-drift-rules';
import { describeParams } from '../utils/describe-params';
import { RULE_EXPLANATIONS, RULE_TITLES } from '../utils/rule-words';
import { RuleEditor } from './rule-editor';
import { RuleExpectationView } from './rule-expectation';
import { RuleVersions } from './rule-versions';

type RuleCardProps = { loop: Loop; kind: DriftRuleKind; rule: DriftRule | undefined; mayEdit: boolean };

function RuleState({ rule }: { rule: DriftRule | undefined }) {
  if (!rule) return <StatusWord tone="none" label="not set up" />;
  return <StatusWord tone={rule.enabled ? 'in_step' : 'stale'} label={rule.enabled ? 'on' : 'off'} />;
}

function Editing({ loop, kind, rule }: Omit<RuleCardProps, 'mayEdit'>) {
  const [open, setOpen] = useState(Boolean(rule));
  if (open) return <RuleEditor loop={loop} kind={kind} rule={rule} />;
  return <Button onClick={() => setOpen(true)}>Set up this rule…</Button>;
}

/** One kind of rule: what it does, how it is set, and what to expect of it. */
export function RuleCard({ loop, kind, rule, mayEdit }: RuleCardProps) {
  return (
    <section aria-label={RULE_TITLES[kind]} className="space-y-3 rounded-sm border border-rule bg-panel px-4 py-3">
      <header className="flex flex-wrap items-center gap-3">
        <h2 className="text-lg font-bold">{RULE_TITLES[kind]}</h2>
        <RuleState rule={rule} />
        {rule ? <PriorityBadge priority={rule.priority} /> : null}
        {rule ? (
          <span className="text-xs text-ink/70 tabular-nums">
            version {rule.version},{' '}
            {formatPlantTime(Date.parse(rule.updatedAt), loop.timeZone, { date: true, seconds: false })}
            {rule.updatedBy ? `, ${rule.updatedBy}` : ''}
          </span>
        ) : null}
      </header>
      <p className="max-w-4xl text-sm">{RULE_EXPLANATIONS[kind]}</p>
      {mayEdit ? (
        <Editing loop={loop} kind={kind} rule={rule} />
      ) : rule ? (
        <>
          <p className="text-sm">{describeParams(kind, rule.params, loop.outputs)}</p>
          <RuleExpectationView expectation={rule.expectation} samplePeriodS={loop.samplePeriodS} />
        </>
      ) : (
        <p className="text-sm text-ink/75">This loop has no {kind} rule. Control engineers set one up here.</p>
      )}
      {rule ? <RuleVersions loopId={loop.id} kind={kind} outputs={loop.outputs} timeZone={loop.timeZone} /> : null}
    </section>
  );
}
