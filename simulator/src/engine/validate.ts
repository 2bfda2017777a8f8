/** One problem found in submitted model data. */
export interface ModelProblem {
  /** Zero-based location in the submitted JSON, e.g. `['A', 1, 0]`. */
  path: (string | number)[];
  /** A sentence a person can act on; rows and columns are counted from 1, as an engineer reads a matrix. */
  message: string;
}

/** Most states a model may have. */
export const MAX_STATES = 200;
/** Most inputs, and most outputs, a model may have. */
export const MAX_SIGNALS = 50;
/** Problems reported at most; beyond it one summary line says how many more there are. */
export const MAX_PROBLEMS = 100;

type Report = (path: (string | number)[], message: string) => void;

/**
 * Checks user-submitted model data `{ A, B, C?, D?, samplePeriodS?, x0?, u0?, y0? }` and lists every
 * problem with its place (`"B row 3 has 1 column, expected 2"`, `"A[2][1] is not a finite number"`,
 * `"A must be square, got 3×2"`). Limits: at most 200 states and 50 inputs or outputs. Never
 * throws on user data; an empty list means the model can be used by the rest of the engine.
 *
 * @param input - the parsed JSON body, of unknown shape
 */
export function validateModel(input: unknown): ModelProblem[] {
  const problems: ModelProblem[] = [];
  const report: Report = (path, message) => problems.push({ path, message });
  if (input === null || typeof input !== 'object' || Array.isArray(input)) {
    return [{ path: [], message: 'the model must be an object with matrices A and B' }];
  }
  const model = input as Record<string, unknown>;
  const A = checkMatrix(model, 'A', report);
  const states = Array.isArray(model.A) && model.A.length > 0 ? model.A.length : undefined;
  if (A && A.rows !== A.columns) report(['A'], `A must be square, got ${A.rows}×${A.columns}`);
  if (states !== undefined && states > MAX_STATES)
    report(['A'], `A has ${states} states; at most ${MAX_STATES} are allowed`);
  const B = checkMatrix(model, 'B', report, states, 'one per state');
  if (B && B.columns > MAX_SIGNALS) report(['B'], `B has ${B.columns} inputs; at most ${MAX_SIGNALS} are allowed`);
  const C = model.C === undefined ? undefined : checkMatrix(model, 'C', report, undefined, '', states);
  if (C && C.rows > MAX_SIGNALS) report(['C'], `C has ${C.rows} outputs; at most ${MAX_SIGNALS} are allowed`);
  const outputs = model.C === undefined ? states : C?.rows;
  if (model.D !== undefined) checkMatrix(model, 'D', report, outputs, 'one per output', B?.columns);
  if (model.samplePeriodS !== undefined && !isPositive(model.samplePeriodS)) {
    report(['samplePeriodS'], 'samplePeriodS must be a positive number of seconds');
  }
  checkVector(model, 'x0', states, 'one per state', report);
  checkVector(model, 'u0', B?.columns, 'one per input', report);
  checkVector(model, 'y0', outputs, 'one per output', report);
  return capped(problems);
}

/**
 * Checks that `model[name]` is a non-empty rectangular array of finite numbers, with `rows` rows and
 * `columns` columns when those are known. Returns its intended shape (rows, and the columns of its
 * first row) so that later checks can compare against it, or undefined when there is none.
 */
function checkMatrix(
  model: Record<string, unknown>,
  name: string,
  report: Report,
  rows?: number,
  rowsWhy = '',
  columns?: number,
): { rows: number; columns: number } | undefined {
  const value = model[name];
  if (value === undefined) return void report([name], `${name} is missing`);
  if (!Array.isArray(value)) return void report([name], `${name} must be an array of rows`);
  if (value.length === 0) return void report([name], `${name} must have at least one row`);
  if (rows !== undefined && value.length !== rows) {
    report([name], `${name} has ${plural(value.length, 'row')}, expected ${rows}${rowsWhy ? ` (${rowsWhy})` : ''}`);
  }
  const first: unknown = value[0];
  const expected = columns ?? (Array.isArray(first) ? first.length : undefined);
  if (expected === 0) return void report([name, 0], `${name} must have at least one column`);
  value.forEach((row: unknown, i: number) => {
    if (!Array.isArray(row)) return report([name, i], `${name} row ${i + 1} must be an array of numbers`);
    if (expected !== undefined && row.length !== expected) {
      report([name, i], `${name} row ${i + 1} has ${plural(row.length, 'column')}, expected ${expected}`);
    }
    if (value.length > MAX_STATES || row.length > MAX_STATES) return;
    row.forEach((entry: unknown, j: number) => {
      if (!isFiniteNumber(entry)) report([name, i, j], `${name}[${i + 1}][${j + 1}] is not a finite number`);
    });
  });
  return expected !== undefined ? { rows: value.length, columns: expected } : undefined;
}

function checkVector(
  model: Record<string, unknown>,
  name: string,
  length: number | undefined,
  why: string,
  report: Report,
) {
  const value = model[name];
  if (value === undefined) return;
  if (!Array.isArray(value)) return report([name], `${name} must be an array of numbers`);
  if (length !== undefined && value.length !== length) {
    report([name], `${name} has ${plural(value.length, 'entry', 'entries')}, expected ${length} (${why})`);
  }
  value.forEach((entry: unknown, i: number) => {
    if (!isFiniteNumber(entry)) report([name, i], `${name}[${i + 1}] is not a finite number`);
  });
}

function capped(problems: ModelProblem[]): ModelProblem[] {
  if (problems.length <= MAX_PROBLEMS) return problems;
  const rest = problems.length - MAX_PROBLEMS;
  return [...problems.slice(0, MAX_PROBLEMS), { path: [], message: `… and ${plural(rest, 'more problem')}` }];
}

function isFiniteNumber(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

function isPositive(value: unknown): boolean {
  return isFiniteNumber(value) && value > 0;
}

function plural(count: number, one: string, many = `${one}s`): string {
  return `${count} ${count === 1 ? one : many}`;
}
