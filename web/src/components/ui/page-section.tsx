import type { ReactNode } from 'react';

/** A titled part of a page, named for assistive technology by its title. */
export function PageSection({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="space-y-2">
      <h2 className="border-b border-rule pb-1 text-lg font-bold">{title}</h2>
      {children}
    </section>
  );
}
