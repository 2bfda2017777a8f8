import { isApiError } from '../../../lib/api';
import type { ModelProblem } from '../types';

export type ServerModelProblems = {
  messages: string[];
  /** Problems that point at one cell (`A.1.0`, zero-based), to mark it in the grid. */
  cells: { grid: string; row: number; column: number; message: string }[];
};

export function serverModelProblems(error: unknown): ServerModelProblems {
  if (!isApiError(error) || error.status !== 400 || !Array.isArray(error.details)) return { messages: [], cells: [] };
  const problems = error.details as Partial<ModelProblem>[];
  const cells = problems.flatMap((problem) => {
    const parts = (problem.field ?? '').split('.');
    if (parts.length !== 3 || !/^\d+$/.test(parts[1]) || !/^\d+$/.test(parts[2])) return [];
    const [grid, row, column] = parts;
    return [{ grid, row: Number(row), column: Number(column), message: problem.message ?? '' }];
  });
  const messages = problems.map((problem) => problem.message).filter((m): m is string => Boolean(m));
  return { messages: messages.length > 0 ? messages : [error.message], cells };
}
