/** One column heading; `hidden` keeps it for screen readers only (e.g. an actions column). */
export interface Column {
  label: string;
  hidden?: boolean;
}

/** The header row every Rillmark data table uses, so tables read and look alike. */
export function TableHead({ columns }: { columns: readonly Column[] }) {
  return (
    <thead className="border-b border-ink-200 text-xs tracking-wide text-ink-500 uppercase">
      <tr>
        {columns.map((column, i) => (
          <th
            key={column.label}
            scope="col"
            className={`py-2 font-semibold whitespace-nowrap ${i < columns.length - 1 ? "pr-4" : ""}`}
          >
            {column.hidden ? <span className="sr-only">{column.label}</span> : column.label}
          </th>
        ))}
      </tr>
    </thead>
  );
}
