// CSV import of accessories: the file is read in the browser first to preview it (the same checks the server
// makes), then uploaded; the server imports all of it or nothing and lists every bad row.
import Papa from 'papaparse';
import { useId, useState } from 'react';
import { detectCsvDelimiter, readAccessoryTable, type CsvProblem } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Notice } from '../../../components/ui/page';
import { refusedCsvRows } from '../../../lib/api-refusals';
import { useImportAccessories } from '../api/use-import-accessories';

function ProblemList({ problems }: { problems: CsvProblem[] }) {
  return (
    <ul className="max-h-64 list-disc overflow-auto pl-5 text-sm" aria-label="Rows to fix">
      {problems.map((p, i) => (
        <li key={i}>
          Row {p.row}, {p.field}: {p.message}
        </li>
      ))}
    </ul>
  );
}

export function AccessoryImportDialog({
  open,
  onClose,
  onDone,
}: {
  open: boolean;
  onClose: () => void;
  onDone: (m: string) => void;
}) {
  const inputId = useId();
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<{ valid: number; problems: CsvProblem[] } | null>(null);
  const upload = useImportAccessories();
  const serverRows = refusedCsvRows(upload.error) ?? [];

  const choose = async (f: File | null) => {
    upload.reset();
    setFile(f);
    setPreview(null);
    if (!f) return;
    const text = (await f.text()).replace(/^\uFEFF/, '');
    const parsed = Papa.parse<string[]>(text, { delimiter: detectCsvDelimiter(text), skipEmptyLines: false });
    const table = readAccessoryTable(parsed.data);
    setPreview({ valid: table.valid.length, problems: table.problems });
  };

  return (
    <Dialog open={open} onClose={onClose} title="Import accessories from CSV" size="md">
      <div className="flex flex-col gap-3">
        <p className="text-sm text-ink-700">
          Columns as the export writes them. New names are added, known names updated; one bad row and nothing is
          imported.
        </p>
        <label htmlFor={inputId} className="text-sm font-semibold text-ink-800">
          CSV file
        </label>
        <input
          id={inputId}
          type="file"
          accept=".csv,text/csv"
          onChange={(e) => void choose(e.target.files?.[0] ?? null)}
        />
        {preview && preview.problems.length > 0 ? (
          <Notice tone="error">
            <p>Nothing can be imported until these rows are fixed:</p>
            <ProblemList problems={preview.problems} />
          </Notice>
        ) : null}
        {preview && preview.problems.length === 0 ? (
          <p role="status" className="text-sm text-ink-700">
            {preview.valid} {preview.valid === 1 ? 'row' : 'rows'} ready to import.
          </p>
        ) : null}
        {upload.error ? (
          <Notice tone="error">
            <p>{upload.error.message}</p>
            {serverRows.length ? <ProblemList problems={serverRows} /> : null}
          </Notice>
        ) : null}
        <div className="flex justify-end">
          <Button
            disabled={!file || !preview || preview.problems.length > 0 || upload.isPending}
            onClick={() =>
              file &&
              upload.mutate(file, {
                onSuccess: (r) => {
                  onDone(`Imported: ${r.created} added, ${r.updated} updated, ${r.unchanged} unchanged.`);
                  setFile(null);
                  setPreview(null);
                },
              })
            }
          >
            Import
          </Button>
        </div>
      </div>
    </Dialog>
  );
}
