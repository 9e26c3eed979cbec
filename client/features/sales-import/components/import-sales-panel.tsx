import { useEffect, useRef } from 'react';
import { MAX_IMPORT_ROWS } from '@contracts/sales-import';
import { CSV_MAX_SIZE } from '@contracts/uploads';
import { FileDropZone } from '../../../components/ui/file-drop-zone';
import { Notice } from '../../../components/ui/notice';
import { ProgressBar } from '../../../components/ui/progress-bar';
import { Button } from '../../../components/ui/button';
import { countWords } from '../lib/count-words';
import { formatBytes, type UploadProgress } from '../../../lib/upload';
import type { ImportResult } from '../api/import-requests';
import { useImportWizard } from '../hooks/use-import-wizard';
import { ColumnMappingForm } from './column-mapping-form';
import { ImportCommitBar } from './import-commit-bar';
import { ImportCounts } from './import-counts';
import { ImportProblemsList } from './import-problems-list';
import { PreviewRowsTable } from './preview-rows-table';

/**
 * The CSV import of sales: choose a file, see how Compline reads it (mapping, first rows, counts,
 * each problem with its row number), then import all valid rows in one go — or none.
 */
export function ImportSalesPanel({ assignmentId, onImported }: { assignmentId: number; onImported?: (result: ImportResult) => void }) {
  const wizard = useImportWizard(assignmentId, onImported);
  const { file, preview, result } = wizard;
  const resultRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (result) resultRef.current?.focus();
  }, [result]);

  return (
    <section aria-labelledby="import-sales-title" className="flex flex-col gap-5 rounded-lg border border-rule bg-paper-raised/50 p-5">
      <header>
        <h3 id="import-sales-title" className="text-lg font-semibold text-ink">
          Import sales from a CSV file
        </h3>
        <p className="mt-1 max-w-3xl text-[0.9375rem] text-ink-soft">
          Export closed sales from your records system as CSV. Compline checks every row before anything is written, and the import is all
          or nothing. Dates are read as year-month-day. A file may hold at most {MAX_IMPORT_ROWS.toLocaleString()} rows;
          split a longer export into several files.
        </p>
      </header>

      {result && (
        <div ref={resultRef} tabIndex={-1} className="focus:outline-none">
          <Notice
            tone="success"
            title={`Imported ${countWords(result.imported, 'sale')}; skipped ${countWords(result.skipped, 'row')}.`}
            actions={<Button size="sm" onClick={wizard.reset}>Import another file</Button>}
          >
            The new sales are in the table and on the map.
          </Notice>
        </div>
      )}

      {!result && (
        <FileDropZone
          inputLabel="CSV file of sales"
          accept=".csv,text/csv"
          disabled={wizard.commitProgress !== null}
          compact={file !== null}
          title={file ? `${file.name} · ${formatBytes(file.size)}` : 'Drop a CSV export here'}
          hint={file ? 'Fixed the file? Drop it here or choose it again.' : `One file, up to ${CSV_MAX_SIZE}, with a header row.`}
          buttonLabel={file ? 'Choose another file' : 'Choose a CSV file'}
          onFiles={(files) => wizard.chooseFile(files[0])}
        />
      )}
      {wizard.fileRefusal && <Notice tone="error" title="That file was not sent">{wizard.fileRefusal}</Notice>}
      {wizard.previewProgress && <PreviewProgress progress={wizard.previewProgress} />}
      {wizard.previewError && (
        <Notice tone="error" title="The file could not be checked" actions={file && <Button size="sm" onClick={() => wizard.chooseFile(file)}>Try again</Button>}>
          {wizard.previewError}
        </Notice>
      )}

      {preview && file && !result && (
        <div className={`flex flex-col gap-6 transition-opacity ${wizard.previewProgress ? 'opacity-60' : ''}`} aria-busy={wizard.previewProgress !== null}>
          <ImportCounts preview={preview} />
          <ColumnMappingForm
            key={`${file.name}-${file.size}-${file.lastModified}`}
            headers={preview.headers}
            mapping={wizard.mapping}
            sampleRow={preview.previewRows[0]}
            disabled={wizard.commitProgress !== null}
            onChange={wizard.setMappingField}
          />
          <div className="flex flex-col gap-2">
            <h4 className="font-semibold text-ink">First rows of the file</h4>
            <PreviewRowsTable headers={preview.headers} rows={preview.previewRows} mapping={preview.mapping} problems={preview.problems} />
          </div>
          <ImportProblemsList problems={preview.problems} problemCount={preview.problemCount} invalidRows={preview.invalidRows} />
          {wizard.commitFailure && (
            <Notice tone="error" title="Nothing was imported">
              <p>{wizard.commitFailure.message}</p>
              {wizard.commitFailure.refusal && (
                <div className="mt-3">
                  <ImportProblemsList title="Rows the server refused" {...wizard.commitFailure.refusal} />
                </div>
              )}
            </Notice>
          )}
          <ImportCommitBar
            preview={preview}
            mapping={wizard.mapping}
            checking={wizard.previewProgress !== null}
            skipInvalid={wizard.skipInvalid}
            onSkipInvalid={wizard.setSkipInvalid}
            progress={wizard.commitProgress}
            onCommit={wizard.commit}
          />
        </div>
      )}
    </section>
  );
}

function PreviewProgress({ progress }: { progress: UploadProgress }) {
  return (
    <div>
      {progress.phase === 'uploading' ? (
        <ProgressBar value={progress.fraction} label="Uploading the file" detail={progress.total ? `${formatBytes(progress.loaded)} of ${formatBytes(progress.total)}` : undefined} />
      ) : (
        <ProgressBar value={null} label="Checking every row" detail="nothing is written yet" />
      )}
    </div>
  );
}
