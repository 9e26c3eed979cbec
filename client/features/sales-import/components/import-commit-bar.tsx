import { importFieldNames, importFields, type ColumnMapping, type ImportPreview } from '@contracts/sales-import';
import { Button } from '../../../components/ui/button';
import { ProgressBar } from '../../../components/ui/progress-bar';
import { countWords } from '../lib/count-words';
import type { UploadProgress } from '../../../lib/upload';

interface ImportCommitBarProps {
  preview: ImportPreview;
  mapping: ColumnMapping;
  checking: boolean;
  skipInvalid: boolean;
  onSkipInvalid: (skip: boolean) => void;
  progress: UploadProgress | null;
  onCommit: () => void;
}

/** Why the import cannot run yet, in words, or null when it can. */
function blockedBecause({ preview, mapping, checking, skipInvalid }: Pick<ImportCommitBarProps, 'preview' | 'mapping' | 'checking' | 'skipInvalid'>): string | null {
  if (checking) return 'Checking the file with the new columns…';
  const unmapped = importFieldNames.filter((f) => importFields[f].required && !mapping[f]).map((f) => importFields[f].label);
  if (unmapped.length) return `Choose a column for ${unmapped.join(', ')}.`;
  if (preview.validRows === 0) return 'No row of this file can be imported as it stands.';
  if (preview.invalidRows > 0 && !skipInvalid) return 'Fix the file and upload it again, or tick the box to leave those rows out.';
  return null;
}

/** The explicit choice to skip rows with problems, the one primary action, and the commit's
 * progress: uploading, then the server validating and writing in one transaction. */
export function ImportCommitBar({ preview, mapping, checking, skipInvalid, onSkipInvalid, progress, onCommit }: ImportCommitBarProps) {
  const blocked = blockedBecause({ preview, mapping, checking, skipInvalid });
  const committing = progress !== null;
  return (
    <div className="flex flex-col gap-4 border-t border-rule pt-4">
      {preview.invalidRows > 0 && (
        <label className="flex items-start gap-2.5 text-[0.9375rem] text-ink">
          <input
            type="checkbox"
            checked={skipInvalid}
            disabled={committing || checking}
            onChange={(event) => onSkipInvalid(event.target.checked)}
            className="mt-1 size-4 accent-ink"
          />
          <span>
            Skip the {countWords(preview.invalidRows, 'row')} with problems
            <span className="block text-[0.8125rem] text-ink-soft">They are left out; every other row is imported.</span>
          </span>
        </label>
      )}
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <Button variant="primary" onClick={onCommit} disabled={blocked !== null} busy={committing} busyLabel="Importing…">
          Import {countWords(preview.validRows, 'sale')}
        </Button>
        {blocked && !committing && <p className="text-[0.875rem] text-ink-soft">{blocked}</p>}
      </div>
      {progress && (
        <div>
          {progress.phase === 'uploading' ? (
            <ProgressBar value={progress.fraction} label="Uploading the file" />
          ) : (
            <ProgressBar value={null} label={`Validating and writing ${countWords(preview.validRows, 'sale')}`} detail="all or nothing" />
          )}
        </div>
      )}
    </div>
  );
}
