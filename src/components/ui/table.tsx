import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';

export function Table({ caption, children }: { caption: string; children: ReactNode }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left text-small">
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
      className={`border-b-2 border-paper-line px-3 py-2 text-caption font-semibold uppercase tracking-[0.08em] text-ink-muted ${className}`}
      {...rest}
    />
  );
}

export function Td({ className = '', ...rest }: TdHTMLAttributes<HTMLTableCellElement>) {
  return <td className={`border-b border-paper-line px-3 py-2.5 align-middle text-ink ${className}`} {...rest} />;
}
