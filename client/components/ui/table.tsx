import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';

/** A ruled table on paper. Wide tables scroll sideways inside their frame rather than the page. */
export function Table({ caption, children, className = '' }: { caption?: string; children: ReactNode; className?: string }) {
  return (
    <div className={`overflow-x-auto rounded-lg border border-rule bg-paper-raised ${className}`}>
      <table className="w-full border-collapse text-left text-[0.9375rem]">
        {caption && <caption className="sr-only">{caption}</caption>}
        {children}
      </table>
    </div>
  );
}

export function Th({ className = '', ...props }: ThHTMLAttributes<HTMLTableCellElement>) {
  return (
    <th
      scope="col"
      className={`border-b border-rule-strong bg-paper-sunk/60 px-4 py-2.5 text-xs font-semibold tracking-wide whitespace-nowrap text-ink-soft uppercase ${className}`}
      {...props}
    />
  );
}

export function Td({ className = '', ...props }: TdHTMLAttributes<HTMLTableCellElement>) {
  return <td className={`border-b border-rule px-4 py-3 align-top ${className}`} {...props} />;
}
