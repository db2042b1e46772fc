// Accessories (coaches): the team's accessory library by category, with add and edit in a form, archive and
// bring back. The week editor fills sessions from it, and the rotation picks from it.
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { ACCESSORY_CATEGORIES, ACCESSORY_CATEGORY_LABELS, type LibraryAccessory } from '../../../shared/schemas';
import { Button, buttonClass } from '../../components/ui/button';
import { Dialog } from '../../components/ui/dialog';
import { LabelledOptions, SelectField, TextField } from '../../components/ui/field';
import { Notice, PageHeader, TrainingCaution } from '../../components/ui/page';
import {
  accessoryFiltersFromSearch,
  accessoryListOptions,
  accessorySearch,
  type AccessoryFilters,
} from '../../features/accessories/api/queries';
import { useUpdateAccessory } from '../../features/accessories/api/use-save-accessory';
import { ACCESSORY_EXPORT_URL } from '../../features/accessories/api/use-import-accessories';
import { AccessoryForm } from '../../features/accessories/components/accessory-form';
import { AccessoryImportDialog } from '../../features/accessories/components/accessory-import-dialog';
import { AccessoryList } from '../../features/accessories/components/accessory-list';
import type { LoaderMaker } from '../guards';

export const makeLoader: LoaderMaker =
  (queryClient) =>
  async ({ request }) => {
    await queryClient.ensureQueryData(
      accessoryListOptions(accessoryFiltersFromSearch(new URL(request.url).searchParams)),
    );
    return null;
  };

export function Component() {
  const [params, setParams] = useSearchParams();
  const filters = accessoryFiltersFromSearch(params);
  const list = useQuery(accessoryListOptions(filters));
  const [editing, setEditing] = useState<LibraryAccessory | 'new' | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [importing, setImporting] = useState(false);
  const archive = useUpdateAccessory();
  const update = (next: Partial<AccessoryFilters>) =>
    setParams(accessorySearch({ ...filters, ...next }), { replace: true });
  const data = list.data;

  return (
    <section>
      <PageHeader
        title="Accessories"
        subtitle="The accessory exercises sessions are filled from, by category, with their default work and joint stress."
        actions={
          <>
            <Button onClick={() => setEditing('new')}>Add accessory</Button>
            <Button variant="secondary" onClick={() => setImporting(true)}>
              Import CSV
            </Button>
            <a className={buttonClass('secondary')} href={ACCESSORY_EXPORT_URL} download>
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
      <div role="search" className="mb-3 grid gap-3 sm:grid-cols-3">
        <TextField label="Search" type="search" value={filters.q} onChange={(e) => update({ q: e.target.value })} />
        <SelectField
          label="Category"
          value={filters.category}
          onChange={(e) => update({ category: e.target.value as AccessoryFilters['category'] })}
        >
          <option value="">All categories</option>
          <LabelledOptions labels={ACCESSORY_CATEGORY_LABELS} values={ACCESSORY_CATEGORIES} />
        </SelectField>
        <label className="inline-flex min-h-11 items-center gap-2 self-end text-sm font-semibold text-ink-800">
          <input
            type="checkbox"
            className="h-5 w-5 accent-rust-500"
            checked={filters.includeArchived}
            onChange={(e) => update({ includeArchived: e.target.checked })}
          />
          Show archived
        </label>
      </div>
      <p role="status" className="mb-2 text-sm text-ink-600" aria-live="polite">
        {data ? (data.total === 0 ? 'No accessories' : `${data.total} accessories`) : 'Loading…'}
      </p>
      {list.error ? <Notice tone="error">{list.error.message}</Notice> : null}
      {archive.error ? <Notice tone="error">{archive.error.message}</Notice> : null}
      <AccessoryList
        items={data?.items ?? []}
        onEdit={(a) => setEditing(a)}
        onArchive={(a, archived) =>
          archive.mutate(
            { id: a.id, body: { archived, version: a.version } },
            {
              onSuccess: (saved) =>
                setMessage(archived ? `${saved.name} was archived.` : `${saved.name} is back in the library.`),
            },
          )
        }
      />
      <Dialog
        open={editing !== null}
        onClose={() => setEditing(null)}
        title={editing === 'new' ? 'Add an accessory' : editing ? `Edit ${editing.name}` : ''}
        size="lg"
      >
        {editing !== null ? (
          <AccessoryForm
            accessory={editing === 'new' ? null : editing}
            onDone={(saved) => {
              setEditing(null);
              setMessage(editing === 'new' ? `${saved.name} was added.` : `${saved.name} was saved.`);
            }}
          />
        ) : null}
      </Dialog>
      <AccessoryImportDialog
        open={importing}
        onClose={() => setImporting(false)}
        onDone={(m) => {
          setImporting(false);
          setMessage(m);
        }}
      />
    </section>
  );
}
