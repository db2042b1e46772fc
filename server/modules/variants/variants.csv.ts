// The library's CSV file: writing it from variants, and reading an uploaded file into rows and problems.
import Papa from 'papaparse';
import {
  LIBRARY_CSV_COLUMNS,
  detectCsvDelimiter,
  readLibraryTable,
  variantToCsvRecord,
  type LibraryTable,
} from '../../../shared/schemas';

type ExportableVariant = Parameters<typeof variantToCsvRecord>[0];

/** RFC 4180 text: a header row of our column names, then one row per variant, CRLF line ends. */
export function buildLibraryCsv(list: ExportableVariant[]): string {
  const data = list.map((v) => {
    const rec = variantToCsvRecord(v);
    return LIBRARY_CSV_COLUMNS.map((c) => rec[c]);
  });
  return Papa.unparse({ fields: [...LIBRARY_CSV_COLUMNS], data }, { newline: '\r\n', quotes: false }) + '\r\n';
}

/** The rows of an uploaded file and every problem with it, papaparse's own (a stray quote) included. */
export function parseLibraryCsv(text: string): LibraryTable {
  const clean = text.replace(/^\uFEFF/, '');
  const result = Papa.parse<string[]>(clean, { delimiter: detectCsvDelimiter(clean), skipEmptyLines: false });
  const table = readLibraryTable(result.data);
  const quoteProblems = result.errors
    .filter((e) => e.type === 'Quotes')
    .map((e) => ({ row: (e.row ?? 0) + 1, field: 'row', message: 'A quote mark is not closed on this row' }));
  return { ...table, problems: [...quoteProblems, ...table.problems] };
}
