import type { DriftRuleKind, Priority } from '@shadowloop/api/contracts';
import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Field, INPUT_CLASSES } from '../../../components/ui/field';
import { NoteField } from '../../../components/ui/note-field';
import { FormError } from '../../alerts/components/form-error';
import type { Loop } from '../../loops/api/get-loops';
import type { DriftRule } from '../api/get-drift-rules';
import { useSaveDriftRule } from '../api/save-drift-rule';
import { useRuleExpectation } from '../hooks/use-rule-expectation';
import { ruleServerErrors } from '../utils/rule-errors';
import { ruleForm, ruleParams, type RuleForm } from '../utils/rule-form';
import { FillSigmaButton } from './fill-sigma-button';
import { RuleExpectationView } from './rule-expectation';
import { RuleParamsFields } from './rule-params-fields';

type RuleEditorProps = { loop: Loop; kind: DriftRuleKind; rule: DriftRule | undefined };

/** Change a rule's settings and see, as you type, what they mean for false alerts. */
export function RuleEditor({ loop, kind, rule }: RuleEditorProps) {
  const [form, setForm] = useState<RuleForm>(() => ruleForm(kind, rule, loop.outputs.length));
  const [saved, setSaved] = useState(false);
  // Problems found in the browser show once the engineer has typed or tried to save, not on a fresh form.
  const [touched, setTouched] = useState(false);
  const update = (patch: Partial<RuleForm>) => {
    setSaved(false);
    setTouched(true);
    setForm((old) => ({ ...old, ...patch }));
  };
  const { params, problems } = ruleParams(kind, form);
  const valid = Object.keys(problems).length === 0;
  const expectation = useRuleExpectation(loop.id, kind, params, valid);
  const save = useSaveDriftRule(loop.id, kind);
  const previewErrors = ruleServerErrors(expectation.error);
  const saveErrors = ruleServerErrors(save.error);
  const errors = { ...previewErrors.fields, ...saveErrors.fields, ...(touched ? problems : {}) };
  const needsSigma = kind !== 'stale';
  const marked = 'see the fields marked above.';
  const problem = !valid ? (touched ? marked : null) : expectation.isError ? (previewErrors.general ?? marked) : null;

  const submit = () => {
    setTouched(true);
    if (!valid) return;
    save.mutate(
      { enabled: form.enabled, priority: form.priority, params, note: form.note.trim() },
      { onSuccess: () => setSaved(true) },
    );
  };

  return (
    <form
      aria-label={`Settings of the ${kind} rule`}
      noValidate
      className="space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
    >
      <div className="flex flex-wrap items-end gap-4">
        <label className="inline-flex items-center gap-2 text-sm font-medium">
          <input type="checkbox" checked={form.enabled} onChange={(e) => update({ enabled: e.target.checked })} />
          Raise alerts with this rule
        </label>
        <Field label="Priority of its alerts" error={errors.priority}>
          {({ inputId, describedBy }) => (
            <select
              id={inputId}
              aria-describedby={describedBy}
              value={form.priority}
              onChange={(e) => update({ priority: Number(e.target.value) as Priority })}
              className={INPUT_CLASSES}
            >
              <option value={1}>P1 high</option>
              <option value={2}>P2 medium</option>
              <option value={3}>P3 low</option>
            </select>
          )}
        </Field>
      </div>
      <RuleParamsFields kind={kind} form={form} outputs={loop.outputs} errors={errors} onChange={update} />
      {needsSigma ? <FillSigmaButton loopId={loop.id} onFill={(sigma) => update({ sigma })} /> : null}
      <RuleExpectationView
        expectation={expectation.isError ? undefined : expectation.data}
        samplePeriodS={loop.samplePeriodS}
        problem={problem}
        pending={expectation.isFetching}
      />
      <NoteField
        label="Why the change (for the version history)"
        value={form.note}
        onChange={(note) => update({ note })}
      />
      <FormError message={saveErrors.general} />
      <div className="flex items-center gap-3">
        <Button type="submit" variant="primary" disabled={save.isPending}>
          Save as a new version
        </Button>
        {saved ? (
          <span role="status" className="text-sm">
            Saved as version {save.data?.version}.
          </span>
        ) : null}
      </div>
    </form>
  );
}
