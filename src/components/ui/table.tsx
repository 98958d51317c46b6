/** The one table look: a scrolling frame, a header row of column names, and rows of cells. */
import type { HTMLAttributes, ReactNode, TdHTMLAttributes } from "react";

interface DataTableProps {
  headings: ReactNode[];
  children: ReactNode;
  /** Visible above the table, or read out by screen readers only when `captionHidden`. */
  caption?: ReactNode;
  captionHidden?: boolean;
  /** Closer rows, for tables inside a card's detail. */
  dense?: boolean;
  className?: string;
}

export function DataTable({ headings, children, caption, captionHidden = false, dense = false, className = "" }: DataTableProps) {
  return (
    <div className="overflow-x-auto">
      <table className={`w-full text-left text-sm ${className}`}>
        {caption !== undefined && <caption className={captionHidden ? "sr-only" : "mb-2 text-left text-ink-500"}>{caption}</caption>}
        <thead className="border-b border-line text-ink-500">
          <tr>
            {headings.map((h, i) => (
              <th key={i} scope="col" className={`${dense ? "py-1" : "py-2"} pr-3 font-semibold`}>
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}

export function Row(props: HTMLAttributes<HTMLTableRowElement>) {
  return <tr className="border-b border-line/60 align-top" {...props} />;
}

export function Cell({ dense = false, className = "", ...rest }: TdHTMLAttributes<HTMLTableCellElement> & { dense?: boolean }) {
  return <td className={`${dense ? "py-1" : "py-2"} pr-3 ${className}`} {...rest} />;
}
