// The app's one table of rows: a caption for screen readers, a header row, a row per item, and an optional
// line when there are none. Every list of records (courses, labs, attempts, the outbox, a handout's values,
// the course page's panels) is drawn with it, so they share spacing, alignment and row headers. Server-safe:
// no hooks, no client code.
import type { HTMLAttributes, ReactNode } from "react";

export interface Column<T> {
  /** the header cell; `srOnly` hides it from sight (a column of links or buttons) */
  header: ReactNode;
  srOnly?: boolean;
  cell: (row: T) => ReactNode;
  /** numbers: right-aligned */
  numeric?: boolean;
  /** the cell that names the row (a <th scope="row">) */
  rowHeader?: boolean;
  /** more classes on this column's cells */
  className?: string | ((row: T) => string);
  /** attributes on this column's cells, e.g. a data-testid */
  cellProps?: (row: T) => HTMLAttributes<HTMLTableCellElement> & Record<`data-${string}`, string>;
}

/** How much room a cell gets: `roomy` for a page's main table, `snug` beside other content, `tight` in a panel. */
type Density = "roomy" | "medium" | "snug" | "tight";
const pad: Record<Density, string> = { roomy: "px-4 py-2", medium: "px-3 py-2", snug: "px-2 py-1", tight: "py-1 pr-3" };

export interface DataTableProps<T> {
  caption: string;
  columns: Column<T>[];
  rows: T[];
  rowKey: (row: T) => string;
  rowProps?: (row: T) => HTMLAttributes<HTMLTableRowElement> & Record<`data-${string}`, string>;
  /** shown in one full-width row when there are no rows */
  empty?: ReactNode;
  density?: Density;
  /** draw the table in a card that scrolls sideways on a narrow screen, with these extra classes */
  card?: string;
  className?: string;
  testId?: string;
}

function cls(...parts: (string | false | undefined)[]) {
  return parts.filter(Boolean).join(" ");
}

export function DataTable<T>({ caption, columns, rows, rowKey, rowProps, empty, density = "roomy", card, className = "min-w-full text-sm", testId }: DataTableProps<T>) {
  const p = pad[density];
  const plainHead = density === "tight";
  const table = (
    <table className={className} data-testid={testId}>
      <caption className="sr-only">{caption}</caption>
      <thead className={plainHead ? "text-left text-ink-soft" : "bg-paper-sunk text-left"}>
        <tr>
          {columns.map((c, i) => (
            <th key={i} scope="col" className={cls(p, c.numeric && "text-right", plainHead && "font-medium")}>
              {c.srOnly ? <span className="sr-only">{c.header}</span> : c.header}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.length === 0 && empty ? (
          <tr>
            <td colSpan={columns.length} className={cls(p, "text-ink-soft")}>
              {empty}
            </td>
          </tr>
        ) : null}
        {rows.map((row) => {
          const extra = rowProps?.(row);
          return (
            <tr key={rowKey(row)} {...extra} className={cls("border-t border-ink/10", extra?.className)}>
              {columns.map((c, i) => {
                const className = cls(p, c.numeric && "text-right tabular-nums", c.rowHeader && "text-left font-normal", typeof c.className === "function" ? c.className(row) : c.className);
                const props = c.cellProps?.(row);
                return c.rowHeader ? (
                  <th key={i} scope="row" className={className} {...props}>
                    {c.cell(row)}
                  </th>
                ) : (
                  <td key={i} className={className} {...props}>
                    {c.cell(row)}
                  </td>
                );
              })}
            </tr>
          );
        })}
      </tbody>
    </table>
  );
  return card !== undefined ? <div className={cls("card overflow-x-auto p-0", card)}>{table}</div> : table;
}
