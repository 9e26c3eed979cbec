import { useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { ColumnMapping, ImportPreview } from '@contracts/sales-import';
import { describeError, isApiError } from '../../../lib/api-error';
import { isAbort, type UploadProgress } from '../../../lib/upload';
import { invalidateAssignmentSales } from '../../../lib/assignment-cache';
import {
  refuseCsvLocally,
  refusedRows,
  requestImportCommit,
  requestImportPreview,
  type ImportRefusal,
  type ImportResult,
} from '../api/import-requests';

export interface CommitFailure {
  message: string;
  /** Present when the server refused rows (422): its own list, as it saw the file just now. */
  refusal: ImportRefusal | null;
}

export interface ImportWizard {
  file: File | null;
  /** Why the chosen file was not sent, when the browser could tell on its own. */
  fileRefusal: string | null;
  preview: ImportPreview | null;
  mapping: ColumnMapping;
  /** Progress of the dry run in flight (the first one, or a re-run after a mapping change). */
  previewProgress: UploadProgress | null;
  previewError: string | null;
  skipInvalid: boolean;
  commitProgress: UploadProgress | null;
  commitFailure: CommitFailure | null;
  result: ImportResult | null;
  chooseFile: (file: File) => void;
  setMappingField: (field: keyof ColumnMapping, header: string) => void;
  setSkipInvalid: (skip: boolean) => void;
  commit: () => void;
  reset: () => void;
}

/**
 * The CSV import as a small state machine: choose → dry run (preview) → adjust the mapping (each
 * change runs the dry run again) → commit. The server keeps nothing between the steps, so each step
 * uploads the file again; a newer dry run cancels an older one still in flight.
 */
export function useImportWizard(assignmentId: number, onImported?: (result: ImportResult) => void): ImportWizard {
  const queryClient = useQueryClient();
  const [file, setFile] = useState<File | null>(null);
  const [fileRefusal, setFileRefusal] = useState<string | null>(null);
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping>({});
  const [previewProgress, setPreviewProgress] = useState<UploadProgress | null>(null);
  const [previewError, setPreviewError] = useState<string | null>(null);
  const [skipInvalid, setSkipInvalid] = useState(false);
  const [commitProgress, setCommitProgress] = useState<UploadProgress | null>(null);
  const [commitFailure, setCommitFailure] = useState<CommitFailure | null>(null);
  const [result, setResult] = useState<ImportResult | null>(null);
  const inFlight = useRef<AbortController | null>(null);
  const shownInvalidRows = useRef<number | null>(null);

  useEffect(() => () => inFlight.current?.abort(), []);

  function runPreview(target: File, wanted: ColumnMapping | null) {
    inFlight.current?.abort();
    const controller = new AbortController();
    inFlight.current = controller;
    setPreviewError(null);
    setCommitFailure(null);
    setPreviewProgress({ phase: 'uploading', loaded: 0, total: target.size, fraction: 0 });
    requestImportPreview(assignmentId, target, wanted, { signal: controller.signal, onProgress: setPreviewProgress })
      .then((answer) => {
        if (controller.signal.aborted) return;
        // A tick for "skip N rows" stands for that N only: a different count asks again.
        if (shownInvalidRows.current !== answer.invalidRows) setSkipInvalid(false);
        shownInvalidRows.current = answer.invalidRows;
        setPreview(answer);
        setMapping(answer.mapping);
        setPreviewProgress(null);
      })
      .catch((error: unknown) => {
        if (isAbort(error) || controller.signal.aborted) return;
        // A re-uploaded file may lack a column the old mapping named: let the server guess afresh.
        if (wanted && isApiError(error) && error.status === 400 && error.fields?.mapping) return runPreview(target, null);
        setPreviewProgress(null);
        setPreviewError(describeError(error));
      });
  }

  function chooseFile(chosen: File) {
    const refusal = refuseCsvLocally(chosen);
    setFileRefusal(refusal);
    setResult(null);
    if (refusal) return;
    // The appraiser's column choices carry over to a fixed copy of the same export.
    const carried = preview ? mapping : null;
    setFile(chosen);
    setPreview(null);
    setSkipInvalid(false);
    runPreview(chosen, carried);
  }

  function setMappingField(field: keyof ColumnMapping, header: string) {
    const next: ColumnMapping = { ...mapping };
    if (header) next[field] = header;
    else delete next[field];
    setMapping(next);
    if (file) runPreview(file, next);
  }

  function commit() {
    if (!file || !preview || commitProgress) return;
    setCommitFailure(null);
    setCommitProgress({ phase: 'uploading', loaded: 0, total: file.size, fraction: 0 });
    requestImportCommit(assignmentId, file, mapping, skipInvalid, { onProgress: setCommitProgress }).then(
      (answer) => {
        setCommitProgress(null);
        setResult(answer);
        shownInvalidRows.current = null;
        setFile(null);
        setPreview(null);
        setSkipInvalid(false);
        void invalidateAssignmentSales(queryClient, assignmentId);
        onImported?.(answer);
      },
      (error: unknown) => {
        setCommitProgress(null);
        setCommitFailure({ message: describeError(error), refusal: refusedRows(error) });
      },
    );
  }

  function reset() {
    inFlight.current?.abort();
    shownInvalidRows.current = null;
    setFile(null);
    setFileRefusal(null);
    setPreview(null);
    setPreviewProgress(null);
    setPreviewError(null);
    setSkipInvalid(false);
    setCommitFailure(null);
    setResult(null);
  }

  return {
    file, fileRefusal, preview, mapping, previewProgress, previewError, skipInvalid, commitProgress, commitFailure, result,
    chooseFile, setMappingField, setSkipInvalid, commit, reset,
  };
}
