import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';

/** A plain data table: header row on a tinted band, figures right-aligned with tabular digits. */
export function Table({ caption, children }: { caption?: string; children: ReactNode }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-small">
        {caption ? <caption className="sr-only">{caption}</caption> : null}
        {children}
      </table>
    </div>
  );
}

export function Th({ numeric, className = '', ...rest }: ThHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return (
    <th
      scope="col"
      className={`whitespace-nowrap border-b border-deck-200 bg-deck-50 px-3 py-2 text-caption font-semibold uppercase text-hull-600 ${numeric ? 'text-right' : 'text-left'} ${className}`}
      {...rest}
    />
  );
}

export function Td({ numeric, className = '', ...rest }: TdHTMLAttributes<HTMLTableCellElement> & { numeric?: boolean }) {
  return <td className={`border-b border-deck-100 px-3 py-2 align-top ${numeric ? 'figures whitespace-nowrap text-right' : ''} ${className}`} {...rest} />;
}
