/** A plant bridge authenticated with an ingest source's token: it may only post readings for its loops. */
export interface IngestPrincipal {
  sourceId: string;
  name: string;
  /** Whether the source is scoped to the loop (one indexed lookup, whatever the number of loops). */
  mayPost(loopId: string): Promise<boolean>;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace -- augmenting Express's request type
  namespace Express {
    interface Request {
      ingest?: IngestPrincipal;
    }
  }
}
