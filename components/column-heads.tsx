/** A table's head: one row of column headings, each `scope="col"` for screen readers. */
export function ColumnHeads({ names, className }: { names: readonly string[]; className?: string }) {
  return (
    <thead>
      <tr className={className}>
        {names.map((name) => (
          <th key={name} scope="col">
            {name}
          </th>
        ))}
      </tr>
    </thead>
  );
}
