import type { ImportPreview } from '@contracts/sales-import';

/** Rows in the file, rows ready to import, rows with problems: three figures in a ruled strip. */
export function ImportCounts({ preview }: { preview: ImportPreview }) {
  const counts: Array<[string, number, string]> = [
    ['Rows in the file', preview.totalRows, 'text-ink'],
    ['Ready to import', preview.validRows, 'text-teal'],
    ['With problems', preview.invalidRows, preview.invalidRows > 0 ? 'text-rust' : 'text-ink-faint'],
  ];
  return (
    <dl aria-label="Rows of the file" className="grid grid-cols-3 divide-x divide-rule rounded-lg border border-rule bg-paper-raised">
      {counts.map(([label, value, tone]) => (
        <div key={label} className="flex flex-col gap-0.5 px-4 py-3">
          <dt className="text-[0.8125rem] text-ink-soft">{label}</dt>
          <dd className={`figures text-2xl leading-tight font-semibold ${tone}`}>{value.toLocaleString()}</dd>
        </div>
      ))}
    </dl>
  );
}
