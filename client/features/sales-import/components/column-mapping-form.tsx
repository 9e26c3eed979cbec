import { useId, useState } from 'react';
import { importFieldNames, importFields, type ColumnMapping, type ImportField } from '@contracts/sales-import';

interface ColumnMappingFormProps {
  headers: readonly string[];
  mapping: ColumnMapping;
  /** The first row of the file, to show what each chosen column holds. */
  sampleRow?: Record<string, string>;
  disabled?: boolean;
  onChange: (field: ImportField, header: string) => void;
}

const selectClasses =
  'block h-9 w-full rounded-md border bg-paper-raised px-2.5 text-[0.9375rem] text-ink focus:border-ink focus:outline-none focus:ring-2 focus:ring-ink/15 disabled:bg-paper-sunk disabled:text-ink-faint';

/** One select per Compline field, each listing the file's columns; required fields come first and
 * say so. Optional fields the file did not fill at first wait behind a button, so that the form
 * stays short; a field stays in view once shown. Changing a select checks the file again. */
export function ColumnMappingForm({ headers, mapping, sampleRow, disabled = false, onChange }: ColumnMappingFormProps) {
  const [initiallyShown] = useState(() => new Set(importFieldNames.filter((f) => importFields[f].required || mapping[f])));
  const [showAll, setShowAll] = useState(false);
  const shown = importFieldNames.filter((f) => showAll || initiallyShown.has(f) || mapping[f]);
  const hidden = importFieldNames.length - shown.length;
  return (
    <fieldset className="flex flex-col gap-3" disabled={disabled}>
      <legend className="text-base font-semibold text-ink">Which column holds each field</legend>
      <p className="-mt-1 text-[0.875rem] text-ink-soft">
        Filled in from your last import and the column names. Change any that are wrong; the check below runs again.
      </p>
      <div className="grid gap-x-5 gap-y-3.5 sm:grid-cols-2 lg:grid-cols-3">
        {shown.map((field) => (
          <MappingSelect key={field} field={field} headers={headers} header={mapping[field] ?? ''} sample={sampleRow?.[mapping[field] ?? '']} onChange={onChange} />
        ))}
      </div>
      {(hidden > 0 || showAll) && (
        <button type="button" onClick={() => setShowAll(!showAll)} className="self-start text-sm font-semibold text-ink-soft underline underline-offset-4 hover:text-ink">
          {showAll ? 'Show only the fields in use' : `Show ${hidden} more ${hidden === 1 ? 'field' : 'fields'} this file could fill`}
        </button>
      )}
    </fieldset>
  );
}

function MappingSelect({ field, headers, header, sample, onChange }: { field: ImportField; headers: readonly string[]; header: string; sample?: string; onChange: ColumnMappingFormProps['onChange'] }) {
  const id = useId();
  const { label, required } = importFields[field];
  const missing = required && !header;
  const noteId = `${id}-note`;
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <label htmlFor={id} className="flex items-baseline gap-2 text-sm font-semibold text-ink">
        {label}
        {required && <span className="text-xs font-medium tracking-wide text-ochre-deep uppercase">required</span>}
      </label>
      <select
        id={id}
        value={header}
        aria-invalid={missing || undefined}
        aria-describedby={noteId}
        onChange={(event) => onChange(field, event.target.value)}
        className={`${selectClasses} ${missing ? 'border-rust' : 'border-rule-strong'}`}
      >
        <option value="">{required ? '— choose a column —' : '— not imported —'}</option>
        {headers.map((h) => (
          <option key={h} value={h}>
            {h}
          </option>
        ))}
      </select>
      <p id={noteId} className={`truncate text-[0.8125rem] ${missing ? 'font-medium text-rust' : 'text-ink-faint'}`}>
        {missing ? `Choose the column with the ${label.toLowerCase()}.` : header ? <>First row: <span className="figures">{sample || '(empty)'}</span></> : 'Left out of the import.'}
      </p>
    </div>
  );
}
