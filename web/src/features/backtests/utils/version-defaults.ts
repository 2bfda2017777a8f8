import type { Version } from '../../models/types';
import { LIMITS } from '../types';

/**
 * The versions a new backtest starts with: the active one and the newest draft or version in
 * review — the comparison an approval needs.
 */
export function defaultVersionIds(versions: readonly Pick<Version, 'id' | 'number' | 'status'>[]): string[] {
  const newestFirst = [...versions].sort((a, b) => b.number - a.number);
  const active = newestFirst.find((v) => v.status === 'active');
  const candidate = newestFirst.find((v) => v.status === 'draft' || v.status === 'in_review');
  return [candidate, active].filter((v) => v !== undefined).map((v) => v.id);
}

/** Ticks or unticks a version; a tick past the limit is refused by the caller, which disables the box. */
export function toggleVersion(picked: readonly string[], versionId: string, on: boolean): string[] {
  if (!on) return picked.filter((id) => id !== versionId);
  if (picked.includes(versionId) || picked.length >= LIMITS.maxVersions) return [...picked];
  return [...picked, versionId];
}
