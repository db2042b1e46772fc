// CSV import: the file is read in the browser first to preview its rows (with the same checks the
// server makes), then uploaded; the server imports all of it or nothing and lists every bad row.
import Papa from 'papaparse';
import { useId, useState } from 'react';
import {
  LIBRARY_CSV_MAX_BYTES,
  detectCsvDelimiter,
  readLibraryTable,
  type CsvProblem,
  type LibraryImportResult,
  type LibraryTable,
} from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { BreakIcon, CleanIcon } from '../../../components/ui/icons';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { refusedCsvRows } from '../../../lib/api-refusals';
import { useImportLibrary } from '../api/use-import-library';

const PREVIEW_ROWS = 50;

export function ImportDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  return (
    <Dialog open={open} onClose={onClose} title="Import variants from CSV" size="lg">
      <ImportBody onClose={onClose} />
    </Dialog>
  );
}

function ImportBody({ onClose }: { onClose: () => void }) {
  const inputId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<LibraryTable | null>(null);
  const [readError, setReadError] = useState<string | null>(null);
  const [serverRows, setServerRows] = useState<CsvProblem[] | null>(null);
  const [done, setDone] = useState<LibraryImportResult | null>(null);
  const upload = useImportLibrary();

  const choose = async (f: File | null) => {
    setFile(f);
    setPreview(null);
    setServerRows(null);
    setDone(null);
    setReadError(null);
    upload.reset();
    if (!f) return;
    if (f.size > LIBRARY_CSV_MAX_BYTES) {
      setReadError('The file is larger than 5 MB. Split it into smaller files.');
      return;
    }
    const text = (await f.text()).replace(/^\uFEFF/, '');
    const parsed = Papa.parse<string[]>(text, { delimiter: detectCsvDelimiter(text), skipEmptyLines: false });
    setPreview(readLibraryTable(parsed.data));
  };

  const send = async () => {
    if (!file) return;
    setServerRows(null);
    try {
      setDone(await upload.mutateAsync(file));
    } catch (err) {
      const rows = isApiError(err, 422) ? refusedCsvRows(err) : null;
      if (rows) setServerRows(rows);
    }
  };

  const problemsByRow = new Map<number, CsvProblem[]>();
  for (const p of serverRows ?? preview?.problems ?? [])
    problemsByRow.set(p.row, [...(problemsByRow.get(p.row) ?? []), p]);
  const headerProblems = problemsByRow.get(1) ?? [];
  const badRows = [...problemsByRow.keys()].filter((row) => row > 1).length;
  const otherFailure = upload.error && !(isApiError(upload.error, 422) && serverRows) ? upload.error.message : null;

  return (
    <div className="flex flex-col gap-4">
      <p className="text-ink-700">
        Use the columns of an exported library (the README lists them). A row whose name is already in the library
        updates that variant; other rows are added. If any row has a problem, nothing is imported.
      </p>
      <div className="flex flex-col gap-1">
        <label htmlFor={inputId} className="text-sm font-semibold text-ink-800">
          CSV file
        </label>
        <input
          id={inputId}
          type="file"
          accept=".csv,text/csv"
          onChange={(e) => void choose(e.target.files?.[0] ?? null)}
          className="block w-full rounded-md border border-ink-300 bg-chalk-50 p-2 file:mr-3 file:rounded file:border-0 file:bg-ink-800 file:px-3 file:py-1.5 file:font-semibold file:text-chalk-50"
        />
      </div>
      {readError ? <Notice tone="error">{readError}</Notice> : null}
      {otherFailure ? <Notice tone="error">{otherFailure}</Notice> : null}
      {done ? (
        <Notice tone="success" title="Imported">
          {done.created} added, {done.updated} updated, {done.unchanged} unchanged.
        </Notice>
      ) : null}
      {serverRows ? (
        <Notice tone="error" title="Nothing was imported">
          {upload.error?.message} Fix the rows below in the file and choose it again.
        </Notice>
      ) : null}

      {preview && !done ? (
        <>
          <p role="status" className="font-semibold">
            {preview.rows.length} {preview.rows.length === 1 ? 'row' : 'rows'} read: {preview.rows.length - badRows}{' '}
            ready, {badRows} with problems.
          </p>
          {headerProblems.length ? (
            <ul className="list-inside list-disc text-breach-700">
              {headerProblems.map((p) => (
                <li key={`${p.field}-${p.message}`}>Header row: {p.message}</li>
              ))}
            </ul>
          ) : null}
          <div className="max-h-80 overflow-auto rounded-md border border-chalk-300">
            <table className="w-full text-left text-sm">
              <caption className="sr-only">Rows of the file</caption>
              <thead className="sticky top-0 bg-chalk-200">
                <tr>
                  {['Row', 'Name', 'Lift', 'Family', 'Check'].map((h) => (
                    <th key={h} scope="col" className="px-2 py-1">
                      {h}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {preview.rows.slice(0, PREVIEW_ROWS).map((r) => {
                  const problems = problemsByRow.get(r.row) ?? [];
                  return (
                    <tr key={r.row} className={`border-t border-chalk-300 ${problems.length ? 'bg-breach-100' : ''}`}>
                      <td className="px-2 py-1 tabular-nums">{r.row}</td>
                      <td className="px-2 py-1">{r.cells.name}</td>
                      <td className="px-2 py-1">{r.cells.lift}</td>
                      <td className="px-2 py-1">{r.cells.family}</td>
                      <td className="px-2 py-1">
                        {problems.length ? (
                          <span className="flex items-start gap-1 text-breach-700">
                            <BreakIcon className="mt-0.5 shrink-0" />
                            <span>
                              {problems.map((p) => (
                                <span key={`${p.field}-${p.message}`} className="block">
                                  {p.field}: {p.message}
                                </span>
                              ))}
                            </span>
                          </span>
                        ) : (
                          <span className="flex items-center gap-1 text-clean-700">
                            <CleanIcon /> Ready
                          </span>
                        )}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
          {preview.rows.length > PREVIEW_ROWS ? (
            <p className="text-sm text-ink-600">The first {PREVIEW_ROWS} rows are shown; every row is checked.</p>
          ) : null}
        </>
      ) : null}

      <div className="flex justify-end gap-2">
        <Button variant="secondary" onClick={onClose}>
          {done ? 'Close' : 'Cancel'}
        </Button>
        {!done ? (
          <Button onClick={send} disabled={!file || !!readError || upload.isPending}>
            {upload.isPending ? 'Importing…' : preview ? `Import ${preview.rows.length} rows` : 'Import'}
          </Button>
        ) : null}
      </div>
    </div>
  );
}
