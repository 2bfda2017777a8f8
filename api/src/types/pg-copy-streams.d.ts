/** The part of pg-copy-streams 7 that Shadowloop uses (the package ships no types). */
declare module 'pg-copy-streams' {
  import type { Writable } from 'node:stream';
  import type { Connection, Submittable } from 'pg';

  export class CopyStreamQuery extends Writable implements Submittable {
    rowCount: number;
    submit(connection: Connection): void;
  }
  /** COPY … FROM STDIN: write rows in the COPY format, then end the stream. */
  export function from(text: string): CopyStreamQuery;
}
