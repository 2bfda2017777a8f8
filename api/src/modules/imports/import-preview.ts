import type { Readable } from 'node:stream';
import Papa from 'papaparse';
import { INGEST_LIMITS, type ImportMapping, type ImportPreview } from '../../contracts/ingest.js';
import type { Db } from '../../db/knex.js';
import { badRequest } from '../../http/errors.js';

const PREVIEW_BYTES = 1024 * 1024;
const TIME_NAMES = ['t', 'time', 'timestamp', 'ts', 'datetime', 'date_time'];

/** The start of the file, enough for the header and the preview rows; the rest flows on unread. */
function readHead(stream: Readable): Promise<string> {
  return new Promise((resolve, reject) => {
    let text = '';
    let settled = false;
    const finish = () => {
      if (settled) return;
      settled = true;
      resolve(text.replace(/^\uFEFF/, ''));
    };
    stream.on('data', (chunk: Buffer) => {
      if (settled) return;
      text += chunk.toString('utf8');
      if (text.split('\n').length > INGEST_LIMITS.previewRows + 2 || text.length > PREVIEW_BYTES) finish();
    });
    stream.once('end', finish);
    stream.once('error', reject);
  });
}

/** Columns named like the loop's signals (and a time column), when every signal was found. */
function suggestMapping(
  header: string[],
  signals: { inputs: { name: string }[]; outputs: { name: string }[] },
): ImportMapping | null {
  const find = (name: string) => header.findIndex((h) => h.trim().toLowerCase() === name.trim().toLowerCase());
  const t = header.findIndex((h) => TIME_NAMES.includes(h.trim().toLowerCase()));
  const u = signals.inputs.map((s) => find(s.name));
  const y = signals.outputs.map((s) => find(s.name));
  if ([...u, ...y].some((i) => i < 0)) return null;
  return { t: header[t >= 0 ? t : 0], u: u.map((i) => header[i]), y: y.map((i) => header[i]) };
}

export async function previewCsv(db: Db, loopId: string, stream: Readable): Promise<ImportPreview> {
  const text = await readHead(stream);
  const parsed = Papa.parse<string[]>(text, { preview: INGEST_LIMITS.previewRows + 1, skipEmptyLines: true });
  const [header, ...rows] = parsed.data;
  if (!header) throw badRequest('The file is empty: the first line must name the columns.');
  const signals = (await db('loops').where({ id: loopId }).first('inputs', 'outputs')) as {
    inputs: { name: string }[];
    outputs: { name: string }[];
  };
  return { header, rows, suggestedMapping: suggestMapping(header, signals) };
}
