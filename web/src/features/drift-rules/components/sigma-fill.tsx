import { useMutation } from '@tanstack/react-query';
import { describeError } from '../../../components/errors/describe-error';

/**
 * Residual standard deviations for the rule form, one per output in the output's unit, with the
 * sentence that says where they came from; sigma is null when there are none, and the sentence says why.
 */
export type SigmaFill = { sigma: number[] | null; sentence: string };

/**
 * Asks for sigma values and puts them in the form's sigma fields, as text. Only the latest ask
 * fills: an earlier answer that arrives late does not overwrite a later pick.
 */
export function useSigmaFill<TVariables = void>(
  fetchFill: (variables: TVariables) => Promise<SigmaFill>,
  onFill: (sigma: string[]) => void,
) {
  const mutation = useMutation<SigmaFill, Error, TVariables>({ mutationFn: fetchFill });
  const fill = (variables: TVariables) =>
    mutation.mutate(variables, {
      onSuccess: ({ sigma }) => {
        if (sigma) onFill(sigma.map(String));
      },
    });
  return { fill, mutation };
}

/** The last fill's sentence, or the problem that kept it from happening. */
export function SigmaFillNote({ mutation }: { mutation: { data: SigmaFill | undefined; error: Error | null } }) {
  if (mutation.error) return <p className="text-xs text-diverged">{describeError(mutation.error).explanation}</p>;
  if (mutation.data) return <p className="text-xs text-ink/75">{mutation.data.sentence}</p>;
  return null;
}
