import { validateModel, type Matrix } from '@shadowloop/simulator/engine';
import type { Loop, UploadedModel, UploadProblem } from '../../contracts/registry.js';
import { AppError } from '../../http/errors.js';
import {
  CONTINUOUS_NAMES,
  DISCRETE_NAMES,
  loopDimensionProblems,
  renameMatrices,
  submittedName,
} from './model-problems.js';
import { readCells, readCsvMatrix } from './upload-cells.js';
import type { UploadedFile } from './upload-files.js';

type MatrixKey = 'A' | 'B' | 'C' | 'D' | 'Ac' | 'Bc';
const MATRIX_KEYS: MatrixKey[] = ['A', 'B', 'C', 'D', 'Ac', 'Bc'];
const KEY_BY_LOWER = new Map(MATRIX_KEYS.map((key) => [key.toLowerCase(), key]));
const NAMING =
  'name each CSV after its matrix: A.csv, B.csv, C.csv, D.csv (or Ac.csv and Bc.csv for a continuous model)';

/** Where an exported version keeps everything but the matrices; uploads skip it. */
const EXPORT_DETAILS_KEY = 'about';

/** Matrices read so far and the file each came from. */
type Found = Partial<Record<MatrixKey, { matrix: Matrix | undefined; file: string }>>;

/** Row and column (from 1) of the "at position N" in a JSON.parse message, when it has one. */
function placeOf(text: string, message: string): { row: number | null; column: number | null } {
  const position = /at position (\d+)/.exec(message);
  if (!position) return { row: null, column: null };
  const before = text.slice(0, Number(position[1])).split('\n');
  return { row: before.length, column: before[before.length - 1].length + 1 };
}

/** Reads the matrices of one JSON document; false when the document itself cannot be used. */
function readJsonModel(file: UploadedFile, found: Found, problems: UploadProblem[]): boolean {
  let document: unknown;
  try {
    document = JSON.parse(file.text);
  } catch (error) {
    const { row, column } = placeOf(file.text, (error as Error).message);
    problems.push({ file: file.name, row, column, message: `not valid JSON: ${(error as Error).message}` });
    return false;
  }
  if (document === null || typeof document !== 'object' || Array.isArray(document)) {
    problems.push({
      file: file.name,
      row: null,
      column: null,
      message: 'the JSON document must be an object such as {"A": [[…]], "B": [[…]]}',
    });
    return false;
  }
  for (const [key, value] of Object.entries(document)) {
    if (key === EXPORT_DETAILS_KEY) continue;
    if (!MATRIX_KEYS.includes(key as MatrixKey)) {
      problems.push({
        file: file.name,
        row: null,
        column: null,
        message: `unknown key "${key}": use A, B, C, D (or Ac, Bc, C, D)`,
      });
    } else if (!Array.isArray(value)) {
      problems.push({ file: file.name, row: null, column: null, message: `${key}: must be an array of rows` });
    } else {
      found[key as MatrixKey] = { file: file.name, matrix: readCells(file.name, key, value, false, problems) };
    }
  }
  return true;
}

function readCsvFiles(files: UploadedFile[], found: Found, problems: UploadProblem[]): void {
  for (const file of files) {
    const key = KEY_BY_LOWER.get(file.name.replace(/\.(csv|tsv|txt)$/i, '').toLowerCase());
    if (!key || !/\.(csv|tsv|txt)$/i.test(file.name)) {
      problems.push({ file: file.name, row: null, column: null, message: `unknown file name: ${NAMING}` });
    } else if (found[key]) {
      problems.push({
        file: file.name,
        row: null,
        column: null,
        message: `${key} arrived twice (also in ${found[key].file}); send one file per matrix`,
      });
    } else {
      found[key] = { file: file.name, matrix: readCsvMatrix(file.name, key, file.text, problems) };
    }
  }
}

/** Which of A, B / Ac, Bc is there; problems when both kinds or a required one is missing. */
function sourceOf(found: Found, problems: UploadProblem[]): UploadedModel['source'] {
  const continuous = Boolean(found.Ac || found.Bc);
  if (continuous && (found.A || found.B)) {
    problems.push({
      file: null,
      row: null,
      column: null,
      message: 'the upload mixes a discrete model (A, B) and a continuous one (Ac, Bc); send one of them',
    });
  }
  const required = continuous ? (['Ac', 'Bc'] as const) : (['A', 'B'] as const);
  for (const key of required)
    if (!found[key])
      problems.push({ file: null, row: null, column: null, message: `${key} is missing: ${NAMING}, or one JSON file` });
  return continuous ? 'continuous' : 'discrete';
}

/** Shape checks of the matrices against each other and against the loop, placed at their file. */
function shapeProblems(found: Found, source: UploadedModel['source'], loop: Loop): UploadProblem[] {
  const names = source === 'continuous' ? CONTINUOUS_NAMES : DISCRETE_NAMES;
  const entry = (engineName: string) => found[submittedName(engineName, names) as MatrixKey];
  const model = {
    A: entry('A')?.matrix,
    B: entry('B')?.matrix,
    ...(found.C ? { C: found.C.matrix } : {}),
    ...(found.D ? { D: found.D.matrix } : {}),
  };
  const located = [
    ...validateModel(model).map((p) => ({
      matrix: String(p.path[0] ?? ''),
      row: p.path[1],
      column: p.path[2],
      message: p.message,
    })),
    ...loopDimensionProblems(model, loop).map((p) => ({
      matrix: p.field,
      row: undefined,
      column: undefined,
      message: p.message,
    })),
  ];
  return located.map((p) => ({
    file: entry(p.matrix)?.file ?? null,
    row: typeof p.row === 'number' ? p.row + 1 : null,
    column: typeof p.column === 'number' ? p.column + 1 : null,
    message: renameMatrices(p.message, names),
  }));
}

/**
 * Reads an upload for the editor — one JSON file with {A, B, C?, D?} or {Ac, Bc, C?, D?}, or one CSV
 * per matrix — and checks it against the loop. Any problem: 400 listing every one with its file,
 * row and column. Nothing is stored.
 */
export function readModelUpload(loop: Loop, files: UploadedFile[]): UploadedModel {
  const problems: UploadProblem[] = [];
  const found: Found = {};
  const json = files.filter((file) => /\.json$/i.test(file.name));
  let readable = true;
  if (json.length > 0 && files.length > 1) {
    problems.push({
      file: null,
      row: null,
      column: null,
      message: 'send either one JSON file with every matrix, or one CSV file per matrix',
    });
    readable = false;
  } else if (json.length === 1) readable = readJsonModel(json[0], found, problems);
  else readCsvFiles(files, found, problems);
  // A document that cannot be read at all is one problem, not also a list of missing matrices.
  const source = readable ? sourceOf(found, problems) : 'discrete';
  if (problems.length === 0) problems.push(...shapeProblems(found, source, loop));
  if (problems.length) {
    throw new AppError(
      400,
      'invalid_upload',
      `The upload has ${problems.length} problem${problems.length === 1 ? '' : 's'}; nothing was read.`,
      problems,
    );
  }
  return { source, ...Object.fromEntries(Object.entries(found).map(([key, value]) => [key, value.matrix])) };
}
