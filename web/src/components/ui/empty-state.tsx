import type { ReactNode } from 'react';

type EmptyStateProps = {
  title: string;
  children: ReactNode;
};

export function EmptyState({ title, children }: EmptyStateProps) {
  return (
    <section aria-label={title} className="rounded-sm border border-dashed border-ink/30 bg-panel px-5 py-6 text-sm">
      <h2 className="text-base font-bold">{title}</h2>
      <div className="mt-2 max-w-3xl space-y-2 text-ink/80">{children}</div>
    </section>
  );
}
