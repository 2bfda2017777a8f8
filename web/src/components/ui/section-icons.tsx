import type { ReactNode } from 'react';
import type { SectionKey } from '../../config/sections';

const ICON_PATHS: Record<SectionKey, ReactNode> = {
  floor: (
    <>
      <rect x="3" y="3" width="6" height="6" rx="1" />
      <rect x="11" y="3" width="6" height="6" rx="1" />
      <rect x="3" y="11" width="6" height="6" rx="1" />
      <rect x="11" y="11" width="6" height="6" rx="1" />
    </>
  ),
  loops: (
    <>
      <path d="M16 10a6 6 0 1 1-1.8-4.3" />
      <path d="M14.6 2.6v3.4h-3.4" />
    </>
  ),
  models: (
    <>
      <path d="M6 3H4v14h2M14 3h2v14h-2" />
      <circle cx="8" cy="7" r="0.9" fill="currentColor" />
      <circle cx="12" cy="7" r="0.9" fill="currentColor" />
      <circle cx="8" cy="13" r="0.9" fill="currentColor" />
      <circle cx="12" cy="13" r="0.9" fill="currentColor" />
    </>
  ),
  alerts: (
    <>
      <path d="M10 2.5 17.5 10 10 17.5 2.5 10Z" />
      <path d="M10 6.5v4.5" />
      <circle cx="10" cy="13.6" r="0.9" fill="currentColor" />
    </>
  ),
  rota: (
    <>
      <rect x="3" y="4.5" width="14" height="12.5" rx="1" />
      <path d="M3 8.5h14M7 2.5v4M13 2.5v4" />
      <rect x="6" y="11" width="3" height="3" fill="currentColor" stroke="none" />
    </>
  ),
  admin: (
    <>
      <path d="M3 5h14M3 10h14M3 15h14" />
      <circle cx="7" cy="5" r="1.6" fill="var(--color-panel)" />
      <circle cx="13" cy="10" r="1.6" fill="var(--color-panel)" />
      <circle cx="9" cy="15" r="1.6" fill="var(--color-panel)" />
    </>
  ),
};

export function SectionIcon({ section }: { section: SectionKey }) {
  return (
    <svg
      width="18"
      height="18"
      viewBox="0 0 20 20"
      fill="none"
      stroke="currentColor"
      strokeWidth="1.6"
      strokeLinecap="round"
      strokeLinejoin="round"
      aria-hidden="true"
      focusable="false"
    >
      {ICON_PATHS[section]}
    </svg>
  );
}
