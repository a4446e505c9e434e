import type { ReactNode } from "react";

/** A column's heading: its words, or its words and the classes of its cell (alignment, padding). */
export type ColumnHead = ReactNode | [label: ReactNode, className: string];

/**
 * A table's row of column headings (`<th scope="col">`), each cell with `className` and its own
 * classes; `false` or null leaves a column out (one shown only sometimes).
 */
export function ColumnHeads({ heads, className = "" }: { heads: (ColumnHead | false | null)[]; className?: string }) {
  return (
    <tr>
      {heads.map((head, i) => {
        if (head === false || head === null) return null;
        const [label, own] = Array.isArray(head) ? head : [head, ""];
        const classes = `${className} ${own}`.trim();
        return (
          <th key={i} scope="col" className={classes || undefined}>
            {label}
          </th>
        );
      })}
    </tr>
  );
}
