import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';

export function Table({ caption, children }: { caption: string; children: ReactNode }) {
  return (
    <div className="overflow-x-auto rounded-sm border border-rule bg-panel">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
  );
}

export function Th({ className = '', ...rest }: ThHTMLAttributes<HTMLTableCellElement>) {
  return (
    <th
      scope="col"
      className={`border-b border-rule bg-paper px-3 py-1.5 text-left text-xs font-bold uppercase tracking-wide text-ink/75 ${className}`}
      {...rest}
    />
  );
}

export function Td({ className = '', ...rest }: TdHTMLAttributes<HTMLTableCellElement>) {
  return <td className={`border-b border-rule px-3 py-1.5 align-middle ${className}`} {...rest} />;
}

export function SkeletonRows({ columns, rows = 4 }: { columns: number; rows?: number }) {
  return (
    <>
      {Array.from({ length: rows }, (_, row) => (
        <tr key={row} aria-hidden="true">
          {Array.from({ length: columns }, (_, column) => (
            <Td key={column}>
              <span className="block h-4 animate-pulse rounded-sm bg-rule/70" />
            </Td>
          ))}
        </tr>
      ))}
    </>
  );
}
