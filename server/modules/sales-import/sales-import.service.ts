import { and, eq, isNull } from 'drizzle-orm';
import { db } from '../../../db/client';
import { importMappings, sales, salesImports } from '../../../db/schema/assignments';
import type { SessionUser } from '../../contracts/auth';
import type { SaleFields } from '../../contracts/sales';
import { importFieldNames, importFields, MAX_IMPORT_ROWS, type ColumnMapping, type ImportPreview, type ImportProblem } from '../../contracts/sales-import';
import { badRequest, unprocessable } from '../../errors';
import { audit } from '../audit/audit.service';
import { assertEditable, loadAssignmentFor } from '../assignments/assignment-access';
import { bumpDataRevision } from '../assignments/assignments.repo';
import { withNeighbourhood } from '../sales/sales.service';
import { insertSalesBulk } from './bulk-insert';
import { guessMapping } from './column-guess';
import { scanCsv } from './csv-scan';
import { duplicateKey, validateRow } from './row-validation';

const PROBLEMS_LISTED = 500;
const PREVIEW_ROWS = 8;

interface Checked {
  headers: string[];
  mapping: ColumnMapping;
  previewRows: Record<string, string>[];
  totalRows: number;
  accepted: SaleFields[];
  invalidRows: number;
  problems: ImportProblem[];
  problemCount: number;
  tooManyRows: boolean;
}

async function existingKeys(assignmentId: number): Promise<Set<string>> {
  const rows = await db
    .select({ address: sales.address, saleDate: sales.saleDate })
    .from(sales)
    .where(and(eq(sales.assignmentId, assignmentId), isNull(sales.deletedAt)));
  return new Set(rows.map((r) => duplicateKey(r.address, r.saleDate)));
}

/** Reads the file once: guesses or applies the mapping, validates every row, finds duplicates of
 * sales already in the assignment and within the file. */
async function checkFile(user: SessionUser, assignmentId: number, filePath: string, mapping: ColumnMapping | null): Promise<Checked> {
  const [saved] = await db.select().from(importMappings).where(eq(importMappings.userId, user.id));
  const seen = await existingKeys(assignmentId);
  const today = new Date().toISOString().slice(0, 10);
  const result: Checked = { headers: [], mapping: {}, previewRows: [], totalRows: 0, accepted: [], invalidRows: 0, problems: [], problemCount: 0, tooManyRows: false };
  const report = (list: ImportProblem[]) => {
    result.invalidRows++;
    result.problemCount += list.length;
    for (const p of list) if (result.problems.length < PROBLEMS_LISTED) result.problems.push(p);
  };
  await scanCsv(
    filePath,
    (headers) => {
      result.headers = headers;
      result.mapping = mapping ?? guessMapping(headers, saved?.mapping ?? {});
      for (const [field, header] of Object.entries(result.mapping)) {
        if (header && !headers.includes(header)) throw badRequest(`The column “${header}” chosen for ${importFields[field as keyof typeof importFields].label} is not in this file.`, { mapping: field });
      }
    },
    (row) => {
      if (result.totalRows === MAX_IMPORT_ROWS) {
        result.tooManyRows = true;
        return 'stop';
      }
      result.totalRows++;
      if (result.previewRows.length < PREVIEW_ROWS) result.previewRows.push(row.values as Record<string, string>);
      const joined = Object.values(row.values).join('');
      if (joined.includes('\uFFFD')) return report([{ row: row.rowNumber, field: 'File', message: 'This row is not UTF-8 text. Save the file as “CSV UTF-8” and try again.' }]);
      if (joined.includes('\u0000')) return report([{ row: row.rowNumber, field: 'File', message: 'This row holds a NUL character, which no text field can store. Save the file again as CSV.' }]);
      if (row.parseErrors.length) return report(row.parseErrors.map((message) => ({ row: row.rowNumber, field: 'File', message })));
      const checked = validateRow(row.values, result.mapping, row.rowNumber, today);
      if (!checked.ok) return report(checked.problems);
      const key = duplicateKey(checked.sale.address, checked.sale.saleDate);
      if (seen.has(key)) {
        return report([{ row: row.rowNumber, field: 'Address', message: `${checked.sale.address} sold on ${checked.sale.saleDate} is already in this assignment (or earlier in this file).` }]);
      }
      seen.add(key);
      result.accepted.push(checked.sale);
    },
  );
  if (result.headers.length === 0) throw badRequest('The file is empty: it needs a header row and at least one sale.', { file: 'Empty file.' });
  if (result.tooManyRows) {
    const limit = MAX_IMPORT_ROWS.toLocaleString('en-US');
    throw unprocessable(`This file has more than ${limit} rows; Compline imports up to ${limit} sales at a time. Split it into smaller files. Nothing was imported.`, { file: 'Too many rows.' });
  }
  return result;
}

export async function previewImport(user: SessionUser, assignmentId: number, filePath: string, mapping: ColumnMapping | null): Promise<ImportPreview> {
  await loadAssignmentFor(db, user, assignmentId);
  const checked = await checkFile(user, assignmentId, filePath, mapping);
  return {
    headers: checked.headers,
    mapping: checked.mapping,
    previewRows: checked.previewRows,
    totalRows: checked.totalRows,
    validRows: checked.accepted.length,
    invalidRows: checked.invalidRows,
    problems: checked.problems,
    problemCount: checked.problemCount,
  };
}

/** Commits every accepted row in one transaction, or nothing. Rows with problems are refused unless
 * the appraiser chose to skip them. */
export async function commitImport(user: SessionUser, assignmentId: number, input: { filePath: string; fileName: string; mapping: ColumnMapping; skipInvalid: boolean }) {
  const missing = importFieldNames.filter((f) => importFields[f].required && !input.mapping[f]);
  if (missing.length) throw badRequest(`Map a column to ${missing.map((f) => importFields[f].label).join(', ')}.`, { mapping: 'Required fields are not mapped.' });
  assertEditable(await loadAssignmentFor(db, user, assignmentId));
  const checked = await checkFile(user, assignmentId, input.filePath, input.mapping);
  if (checked.invalidRows > 0 && !input.skipInvalid) {
    throw unprocessable(
      `${checked.invalidRows} row${checked.invalidRows === 1 ? ' has' : 's have'} problems. Fix the file, or skip those rows explicitly. Nothing was imported.`,
      undefined,
      { problems: checked.problems, problemCount: checked.problemCount, invalidRows: checked.invalidRows },
    );
  }
  if (checked.accepted.length === 0) throw unprocessable('No row of this file can be imported. Nothing was imported.');
  return db.transaction(async (tx) => {
    assertEditable(await loadAssignmentFor(tx, user, assignmentId));
    const [run] = await tx
      .insert(salesImports)
      .values({ assignmentId, userId: user.id, fileName: input.fileName.slice(0, 200), rowsImported: checked.accepted.length, rowsSkipped: checked.invalidRows })
      .returning({ id: salesImports.id });
    await insertSalesBulk(tx, assignmentId, run.id, checked.accepted.map((s) => withNeighbourhood(s)));
    await tx
      .insert(importMappings)
      .values({ userId: user.id, mapping: input.mapping })
      .onConflictDoUpdate({ target: importMappings.userId, set: { mapping: input.mapping } });
    await bumpDataRevision(tx, assignmentId);
    await audit(tx, {
      actorUserId: user.id,
      organisationId: user.organisationId,
      action: 'sales-imported',
      entityType: 'assignment',
      entityId: assignmentId,
      details: { importId: run.id, fileName: input.fileName, imported: checked.accepted.length, skipped: checked.invalidRows },
    });
    return { importId: run.id, imported: checked.accepted.length, skipped: checked.invalidRows };
  });
}
