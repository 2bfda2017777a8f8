import type { DriftRuleKind } from '@shadowloop/api/contracts';
import type { RuleForm } from '../utils/rule-form';
import { NumberField, PerOutputFields } from './number-field';

type RuleParamsFieldsProps = {
  kind: DriftRuleKind;
  form: RuleForm;
  outputs: { name: string; unit: string }[];
  errors: Record<string, string>;
  onChange: (patch: Partial<RuleForm>) => void;
};

function Persistence({ form, errors, onChange }: Pick<RuleParamsFieldsProps, 'form' | 'errors' | 'onChange'>) {
  return (
    <>
      <NumberField
        label="Raise after"
        unit="samples in a row"
        value={form.raiseAfter}
        error={errors.raiseAfter}
        onChange={(raiseAfter) => onChange({ raiseAfter })}
      />
      <NumberField
        label="Clear after"
        unit="samples in a row"
        value={form.clearAfter}
        error={errors.clearAfter}
        onChange={(clearAfter) => onChange({ clearAfter })}
      />
    </>
  );
}

function BandFields({ form, outputs, errors, onChange }: Omit<RuleParamsFieldsProps, 'kind'>) {
  return (
    <div className="space-y-3">
      <fieldset className="text-sm">
        <legend className="font-medium">Limit</legend>
        <div className="mt-1 flex flex-wrap gap-4">
          <label className="inline-flex items-center gap-1.5">
            <input
              type="radio"
              name="band-mode"
              checked={form.mode === 'sigma'}
              onChange={() => onChange({ mode: 'sigma' })}
            />
            k times each output&apos;s residual standard deviation
          </label>
          <label className="inline-flex items-center gap-1.5">
            <input
              type="radio"
              name="band-mode"
              checked={form.mode === 'absolute'}
              onChange={() => onChange({ mode: 'absolute' })}
            />
            a limit per output in its own unit
          </label>
        </div>
      </fieldset>
      {form.mode === 'absolute' ? (
        <PerOutputFields
          legend="Limit of |residual| per output"
          hint="Leave an output blank to leave it unwatched."
          field="limits"
          outputs={outputs}
          values={form.limits}
          errors={errors}
          onChange={(limits) => onChange({ limits })}
        />
      ) : (
        <NumberField
          label="k"
          unit="standard deviations"
          value={form.k}
          error={errors.k}
          onChange={(k) => onChange({ k })}
        />
      )}
      <PerOutputFields
        legend="Residual standard deviation (sigma) per output"
        hint={form.mode === 'absolute' ? 'Optional here: only for the expected false-alert interval.' : undefined}
        field="sigma"
        outputs={outputs}
        values={form.sigma}
        errors={errors}
        onChange={(sigma) => onChange({ sigma })}
      />
      <div className="flex flex-wrap gap-3">
        <Persistence form={form} errors={errors} onChange={onChange} />
        <NumberField
          label="Clear deadband"
          unit="% of the limit"
          hint="Clearing needs every residual this far inside its limit."
          value={form.deadbandPercent}
          error={errors.deadband}
          onChange={(deadbandPercent) => onChange({ deadbandPercent })}
        />
      </div>
    </div>
  );
}

function CusumFields({ form, outputs, errors, onChange }: Omit<RuleParamsFieldsProps, 'kind'>) {
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-3">
        <NumberField
          label="Allowance k"
          unit="standard deviations"
          value={form.k}
          error={errors.k}
          onChange={(k) => onChange({ k })}
        />
        <NumberField
          label="Decision interval h"
          unit="standard deviations"
          value={form.h}
          error={errors.h}
          onChange={(h) => onChange({ h })}
        />
        <NumberField
          label="Shift to detect"
          unit="standard deviations"
          hint="Only for the expected detection delay."
          value={form.shift}
          error={errors.shift}
          onChange={(shift) => onChange({ shift })}
        />
      </div>
      <PerOutputFields
        legend="Residual standard deviation (sigma) per output"
        field="sigma"
        outputs={outputs}
        values={form.sigma}
        errors={errors}
        onChange={(sigma) => onChange({ sigma })}
      />
    </div>
  );
}

function NisFields({ form, outputs, errors, onChange }: Omit<RuleParamsFieldsProps, 'kind'>) {
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-3">
        <NumberField
          label="False-alarm probability per sample"
          hint="e.g. 0.001"
          value={form.falseAlarmProbability}
          error={errors.falseAlarmProbability}
          onChange={(falseAlarmProbability) => onChange({ falseAlarmProbability })}
        />
        <Persistence form={form} errors={errors} onChange={onChange} />
      </div>
      <PerOutputFields
        legend="Residual standard deviation (sigma) per output"
        hint="Needed when the active version has no Kalman correction; with one, its innovation covariance is used."
        field="sigma"
        outputs={outputs}
        values={form.sigma}
        errors={errors}
        onChange={(sigma) => onChange({ sigma })}
      />
    </div>
  );
}

/** The settings of one kind of rule, each number with its unit. */
export function RuleParamsFields(props: RuleParamsFieldsProps) {
  const { kind, form, errors, onChange } = props;
  if (kind === 'band') return <BandFields {...props} />;
  if (kind === 'cusum') return <CusumFields {...props} />;
  if (kind === 'nis') return <NisFields {...props} />;
  return (
    <NumberField
      label="Raise after"
      unit="sample periods without a reading"
      value={form.afterSamples}
      error={errors.afterSamples}
      onChange={(afterSamples) => onChange({ afterSamples })}
    />
  );
}
