// Library (coaches): the team's variants in a sortable, filterable table, with add and edit in a form,
// CSV import with a preview, and export. The filters live in the URL, so a filtered view can be shared.
import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import type { LibraryVariant } from '../../../shared/schemas';
import { Button, buttonClass } from '../../components/ui/button';
import { Dialog } from '../../components/ui/dialog';
import { Notice, PageHeader, TrainingCaution } from '../../components/ui/page';
import {
  EXPORT_URL,
  LIBRARY_PAGE_SIZE,
  filtersFromSearch,
  variantFacetsOptions,
  variantListOptions,
  type LibraryFilters,
} from '../../features/library/api/queries';
import { DeleteVariantDialog } from '../../features/library/components/delete-variant-dialog';
import { ImportDialog } from '../../features/library/components/import-dialog';
import { LibraryFiltersBar } from '../../features/library/components/library-filters';
import { VariantForm } from '../../features/library/components/variant-form';
import { VariantTable } from '../../features/library/components/variant-table';
import { useUpdateVariant } from '../../features/library/api/use-save-variant';
import type { LoaderMaker } from '../guards';

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ request }) => {
    const filters = filtersFromSearch(new URL(request.url).searchParams);
    await Promise.all([
      queryClient.ensureQueryData(variantListOptions(filters)),
      queryClient.ensureQueryData(variantFacetsOptions()),
    ]);
    return null;
  };

function toSearch(f: LibraryFilters): URLSearchParams {
  const p = new URLSearchParams();
  if (f.q) p.set('q', f.q);
  if (f.lift) p.set('lift', f.lift);
  if (f.family) p.set('family', f.family);
  if (f.equipment) p.set('equipment', f.equipment);
  if (f.risk) p.set('risk', f.risk);
  if (f.includeArchived) p.set('archived', 'shown');
  if (f.sort !== 'name') p.set('sort', f.sort);
  if (f.page > 1) p.set('page', String(f.page));
  return p;
}

export function Component() {
  const [params, setParams] = useSearchParams();
  const filters = filtersFromSearch(params);
  const list = useQuery(variantListOptions(filters));
  const { data: facets } = useSuspenseQuery(variantFacetsOptions());
  const [editing, setEditing] = useState<LibraryVariant | 'new' | null>(null);
  const [deleting, setDeleting] = useState<LibraryVariant | null>(null);
  const [importing, setImporting] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  const restore = useUpdateVariant();

  const update = useCallback(
    (next: Partial<LibraryFilters>) =>
      setParams((prev) => toSearch({ ...filtersFromSearch(prev), page: 1, ...next }), { replace: true }),
    [setParams],
  );

  const data = list.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / LIBRARY_PAGE_SIZE)) : 1;
  const first = data && data.total > 0 ? (filters.page - 1) * LIBRARY_PAGE_SIZE + 1 : 0;
  const last = data ? Math.min(data.total, filters.page * LIBRARY_PAGE_SIZE) : 0;

  return (
    <section>
      <PageHeader
        title="Library"
        subtitle="Every max-effort variant the board can pick from, with its joint stress, risk and closeness to the competition lift."
        actions={
          <>
            <Button onClick={() => setEditing('new')}>Add variant</Button>
            <Button variant="secondary" onClick={() => setImporting(true)}>
              Import CSV
            </Button>
            <a className={buttonClass('secondary')} href={EXPORT_URL} download>
              Export CSV
            </a>
          </>
        }
      />
      <TrainingCaution className="mb-4" />
      {message ? (
        <div className="mb-3">
          <Notice tone="success">{message}</Notice>
        </div>
      ) : null}
      <LibraryFiltersBar filters={filters} facets={facets} onChange={update} />
      <p role="status" className="mb-2 text-sm text-ink-600" aria-live="polite">
        {data ? (data.total === 0 ? 'No variants' : `Showing ${first}–${last} of ${data.total} variants`) : 'Loading…'}
        {list.isFetching && data ? ' · updating…' : ''}
      </p>
      {list.error ? <Notice tone="error">{list.error.message}</Notice> : null}
      <VariantTable
        items={data?.items ?? []}
        sort={filters.sort}
        onSort={(sort) => update({ sort })}
        onEdit={(v) => setEditing(v)}
        onDelete={(v) => setDeleting(v)}
        onRestore={(v) =>
          restore.mutate(
            { id: v.id, body: { archived: false, version: v.version } },
            { onSuccess: (saved) => setMessage(`${saved.name} is back in the library.`) },
          )
        }
      />
      {restore.error ? <Notice tone="error">{restore.error.message}</Notice> : null}
      {pages > 1 ? (
        <nav aria-label="Pages" className="mt-3 flex items-center gap-2">
          <Button
            variant="secondary"
            size="sm"
            disabled={filters.page <= 1}
            onClick={() => update({ page: filters.page - 1 })}
          >
            Previous
          </Button>
          <span className="text-sm">
            Page {filters.page} of {pages}
          </span>
          <Button
            variant="secondary"
            size="sm"
            disabled={filters.page >= pages}
            onClick={() => update({ page: filters.page + 1 })}
          >
            Next
          </Button>
        </nav>
      ) : null}

      <Dialog
        open={editing !== null}
        onClose={() => setEditing(null)}
        title={editing === 'new' ? 'Add a variant' : editing ? `Edit ${editing.name}` : ''}
        size="lg"
      >
        {editing !== null ? (
          <VariantForm
            variant={editing === 'new' ? null : editing}
            facets={facets}
            onDone={(saved) => {
              setEditing(null);
              setMessage(editing === 'new' ? `${saved.name} was added.` : `${saved.name} was saved.`);
            }}
          />
        ) : null}
      </Dialog>
      <DeleteVariantDialog
        variant={deleting}
        onClose={() => setDeleting(null)}
        onDone={(m) => {
          setDeleting(null);
          setMessage(m);
        }}
      />
      <ImportDialog open={importing} onClose={() => setImporting(false)} />
    </section>
  );
}
