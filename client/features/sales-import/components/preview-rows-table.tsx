import { importFields, type ColumnMapping, type ImportField, type ImportProblem } from '@contracts/sales-import';

interface PreviewRowsTableProps {
  headers: readonly string[];
  rows: ReadonlyArray<Record<string, string>>;
  mapping: ColumnMapping;
  problems: readonly ImportProblem[];
}

/** The first rows of the file as they are, numbered as a spreadsheet numbers them (the header is
 * row 1). Under each column name: the Compline field it feeds. Cells with a problem are marked. */
export function PreviewRowsTable({ headers, rows, mapping, problems }: PreviewRowsTableProps) {
  const fieldOf = new Map<string, ImportField>();
  for (const [field, header] of Object.entries(mapping)) if (header) fieldOf.set(header, field as ImportField);
  const problemCells = new Set(problems.map((p) => `${p.row}|${p.field}`));
  const hasProblem = (rowNumber: number, header: string) => {
    const field = fieldOf.get(header);
    return field ? problemCells.has(`${rowNumber}|${importFields[field].label}`) : false;
  };

  return (
    <div className="overflow-x-auto rounded-lg border border-rule bg-paper-raised" tabIndex={0} role="region" aria-label="First rows of the file">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">First rows of the file, with the field each column feeds</caption>
        <thead>
          <tr>
            <th scope="col" className="border-b border-rule-strong bg-paper-sunk/60 px-3 py-2 text-xs font-semibold text-ink-soft uppercase">
              Row
            </th>
            {headers.map((header) => {
              const field = fieldOf.get(header);
              return (
                <th key={header} scope="col" className="border-b border-rule-strong bg-paper-sunk/60 px-3 py-2 align-bottom whitespace-nowrap">
                  <span className="block font-semibold text-ink">{header}</span>
                  <span className={`block text-xs font-normal ${field ? 'text-teal' : 'text-ink-faint'}`}>{field ? `→ ${importFields[field].label}` : 'not imported'}</span>
                </th>
              );
            })}
          </tr>
        </thead>
        <tbody>
          {rows.map((row, index) => {
            const rowNumber = index + 2;
            return (
              <tr key={rowNumber}>
                <th scope="row" className="figures border-b border-rule px-3 py-1.5 text-right font-normal text-ink-faint">
                  {rowNumber}
                </th>
                {headers.map((header) => {
                  const flagged = hasProblem(rowNumber, header);
                  return (
                    <td
                      key={header}
                      className={`figures max-w-[16rem] truncate border-b border-rule px-3 py-1.5 whitespace-nowrap ${flagged ? 'bg-rust-wash text-rust' : fieldOf.has(header) ? 'text-ink' : 'text-ink-faint'}`}
                      title={row[header]}
                    >
                      {row[header] ?? ''}
                    </td>
                  );
                })}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
