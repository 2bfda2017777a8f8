import type { ModelProblem as EngineProblem } from '@shadowloop/simulator/engine';
import type { Loop, ModelProblem } from '../../contracts/registry.js';
import { AppError } from '../../http/errors.js';

/** Names under which the engine's A and B were submitted (Ac and Bc for a continuous model). */
export type MatrixNames = { A: string; B: string };
export const DISCRETE_NAMES: MatrixNames = { A: 'A', B: 'B' };
export const CONTINUOUS_NAMES: MatrixNames = { A: 'Ac', B: 'Bc' };

/** The 400 for a model that cannot be used, listing every problem. */
export function invalidModel(problems: ModelProblem[]): AppError {
  const summary = problems
    .slice(0, 3)
    .map((p) => p.message)
    .join('; ');
  const more = problems.length > 3 ? ` (and ${problems.length - 3} more)` : '';
  return new AppError(
    400,
    'invalid_model',
    `The model has ${problems.length} problem${problems.length === 1 ? '' : 's'}: ${summary}${more}.`,
    problems,
  );
}

/** The submitted name of an engine matrix name (A → Ac for a continuous model). */
export const submittedName = (name: string, names: MatrixNames) =>
  name === 'A' ? names.A : name === 'B' ? names.B : name;

/** An engine message about A or B, in the names the model was submitted with. */
export const renameMatrices = (message: string, names: MatrixNames) =>
  message.replace(/^(A|B)(?=[\s[])/, (name) => submittedName(name, names));

/** An engine problem in API terms, with A and B renamed when the model came in as Ac and Bc. */
export function fromEngineProblem(problem: EngineProblem, names: MatrixNames = DISCRETE_NAMES): ModelProblem {
  const [head, ...rest] = problem.path;
  return {
    field: [submittedName(String(head ?? ''), names), ...rest].join('.'),
    message: renameMatrices(problem.message, names),
  };
}

const signalList = (signals: Loop['inputs']) =>
  signals
    .slice(0, 6)
    .map((s) => s.name)
    .join(', ') + (signals.length > 6 ? ', …' : '');
const plural = (count: number, word: string) => `${count} ${word}${count === 1 ? '' : 's'}`;
const rowsOf = (value: unknown) => (Array.isArray(value) && value.length > 0 ? value.length : undefined);
const columnsOf = (value: unknown) => (Array.isArray(value) && Array.isArray(value[0]) ? value[0].length : undefined);

/**
 * Sizes the loop's signals demand: A rows = states, B columns = inputs, C rows = outputs (without C
 * every state is an output). The engine checks the matrices against each other.
 */
export function loopDimensionProblems(
  model: { A?: unknown; B?: unknown; C?: unknown },
  loop: Loop,
  names = DISCRETE_NAMES,
): ModelProblem[] {
  const problems: ModelProblem[] = [];
  const [n, m, p] = [loop.states.length, loop.inputs.length, loop.outputs.length];
  const add = (field: string, message: string) => problems.push({ field, message });
  const has = (count: number, what: string, signals: Loop['inputs']) =>
    `loop ${loop.tag} has ${count} ${count === 1 ? what.slice(0, -1) : what} (${signalList(signals)})`;
  const aRows = rowsOf(model.A);
  if (aRows !== undefined && aRows !== n)
    add(names.A, `${names.A} has ${plural(aRows, 'row')}, expected ${n}: ${has(n, 'states', loop.states)}`);
  const bColumns = columnsOf(model.B);
  if (bColumns !== undefined && bColumns !== m)
    add(names.B, `${names.B} has ${plural(bColumns, 'column')}, expected ${m}: ${has(m, 'inputs', loop.inputs)}`);
  const cRows = rowsOf(model.C);
  if (model.C === undefined && p !== n)
    add(
      'C',
      `C is missing: without it every state is an output, but ${has(p, 'outputs', loop.outputs)} and ${n} states`,
    );
  if (cRows !== undefined && cRows !== p)
    add('C', `C has ${plural(cRows, 'row')}, expected ${p}: ${has(p, 'outputs', loop.outputs)}`);
  return problems;
}
