import type { AuditEntry } from '../api/get-audit-log';

type RegistryDetails = { loopTag?: unknown; versionNumber?: unknown };

/** `DIG-TEMP-301 · version 2` for registry entries; the raw target for everything else. */
export function describeTarget(entry: Pick<AuditEntry, 'target' | 'details'>): string {
  const details = (typeof entry.details === 'object' && entry.details !== null ? entry.details : {}) as RegistryDetails;
  if (typeof details.loopTag !== 'string') return entry.target ?? '—';
  return typeof details.versionNumber === 'number'
    ? `${details.loopTag} · version ${details.versionNumber}`
    : details.loopTag;
}
