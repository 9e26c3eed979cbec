import { createReadStream } from 'node:fs';
import Papa from 'papaparse';

export interface CsvRow {
  /** Row number as a spreadsheet shows it: the header is row 1. */
  rowNumber: number;
  values: Record<string, string | undefined>;
  /** Quoting or shape problems papaparse found on this row. */
  parseErrors: string[];
}

/** Streams a CSV file from disk row by row (the file is never held whole in memory). The first
 * line is the header; a byte-order mark and surrounding spaces are dropped from header names.
 * `onRow` may answer 'stop' to end the scan there (the rest of the file is not read). */
export function scanCsv(filePath: string, onHeaders: (headers: string[]) => void, onRow: (row: CsvRow) => void | 'stop'): Promise<void> {
  return new Promise((resolve, reject) => {
    let rowNumber = 1;
    let headersSeen = false;
    const file = createReadStream(filePath, { encoding: 'utf8' });
    Papa.parse<Record<string, string>>(file as unknown as File, {
      header: true,
      skipEmptyLines: 'greedy',
      transformHeader: (h) => h.replace(/^\uFEFF/, '').trim(),
      step(results, parser) {
        if (!headersSeen) {
          headersSeen = true;
          onHeaders(results.meta.fields ?? []);
        }
        rowNumber++;
        const parseErrors = results.errors.map((e) =>
          e.code === 'TooManyFields' ? 'This row has more cells than the header.' : e.code === 'TooFewFields' ? 'This row has fewer cells than the header.' : `${e.message}.`,
        );
        if (onRow({ rowNumber, values: results.data, parseErrors }) === 'stop') {
          parser.abort();
          file.destroy();
        }
      },
      complete: () => {
        if (!headersSeen) onHeaders([]);
        resolve();
      },
      error: (err: Error) => reject(err),
    });
  });
}
