/** The figures behind a chart, folded under it: what a screen reader (or a careful reader) uses. */
export function FiguresTable({ caption, columns, rows }: { caption: string; columns: string[]; rows: string[][] }) {
  if (rows.length === 0) return null
  return (
    <details className="text-sm">
      <summary className="cursor-pointer text-signal">Show the figures</summary>
      <div className="overflow-x-auto">
        <table className="mt-2 min-w-full border-collapse font-mono">
          <caption className="sr-only">{caption}</caption>
          <thead>
            <tr>
              {columns.map((c) => (
                <th key={c} scope="col" className="border-b border-rule px-2 py-1 text-left font-sans font-semibold">
                  {c}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {rows.map((r, i) => (
              <tr key={i}>
                {r.map((cell, j) => (
                  <td key={j} className="border-b border-rule px-2 py-1">
                    {cell}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  )
}
