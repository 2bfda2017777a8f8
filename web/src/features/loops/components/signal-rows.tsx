import { useFieldArray, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { INPUT_CLASSES } from '../../../components/ui/field';
import { EMPTY_SIGNAL, type LoopFormValues, type SignalGroup } from '../utils/loop-form-values';

const GROUP_TEXT: Record<SignalGroup, { title: string; word: string; hint: string }> = {
  inputs: {
    title: 'Inputs',
    word: 'Input',
    hint: 'What the twin is given every sample, in the order of the columns of B — e.g. blower speed in %.',
  },
  states: {
    title: 'States',
    word: 'State',
    hint: 'The model’s state variables, in the order of the rows and columns of A.',
  },
  outputs: {
    title: 'Outputs',
    word: 'Output',
    hint: 'The measured signals the twin predicts, in the order of the rows of C.',
  },
};

type SignalRowsProps = {
  group: SignalGroup;
  control: Control<LoopFormValues>;
  register: UseFormRegister<LoopFormValues>;
  errors: FieldErrors<LoopFormValues>;
};

export function SignalRows({ group, control, register, errors }: SignalRowsProps) {
  const { fields, append, remove } = useFieldArray({ control, name: group });
  const { title, word, hint } = GROUP_TEXT[group];
  const groupErrors = errors[group];
  const groupProblem = groupErrors?.root?.message ?? groupErrors?.message;
  const cell = (i: number, key: 'name' | 'unit' | 'operatingValue', label: string, width: string) => {
    const message = groupErrors?.[i]?.[key]?.message;
    return (
      <td className="py-1 pr-2 align-top">
        <input
          aria-label={`${word} ${i + 1} ${label}`}
          aria-invalid={message ? true : undefined}
          className={`${width} ${INPUT_CLASSES}`}
          {...register(`${group}.${i}.${key}`)}
        />
        {message ? <p className="mt-0.5 text-xs font-medium text-diverged">{message}</p> : null}
      </td>
    );
  };
  return (
    <fieldset className="rounded-sm border border-rule bg-panel px-3 py-2">
      <legend className="px-1 font-bold">{title}</legend>
      <p className="text-xs text-ink/70">{hint}</p>
      <table className="mt-2 text-sm">
        <thead>
          <tr className="text-left text-xs text-ink/75">
            <th className="pr-2 font-medium">#</th>
            <th className="pr-2 font-medium">Name</th>
            <th className="pr-2 font-medium">Unit</th>
            <th className="pr-2 font-medium">Value at the operating point (empty: 0)</th>
            <th>
              <span className="sr-only">Remove</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {fields.map((field, i) => (
            <tr key={field.id}>
              <td className="py-1 pr-2 align-top tabular-nums leading-8">{i + 1}</td>
              {cell(i, 'name', 'name', 'w-52')}
              {cell(i, 'unit', 'unit', 'w-24')}
              {cell(i, 'operatingValue', 'value at the operating point', 'w-32')}
              <td className="py-1 align-top">
                <Button
                  variant="quiet"
                  disabled={fields.length === 1}
                  onClick={() => remove(i)}
                  aria-label={`Remove ${word.toLowerCase()} ${i + 1}`}
                >
                  Remove
                </Button>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {groupProblem ? <p className="mt-1 text-xs font-medium text-diverged">{groupProblem}</p> : null}
      <Button className="mt-2" onClick={() => append({ ...EMPTY_SIGNAL })}>
        Add {/^[aeiou]/i.test(word) ? 'an' : 'a'} {word.toLowerCase()}
      </Button>
    </fieldset>
  );
}
