// Confirms a delete, saying up front whether the variant will be archived (it is in someone's history).
import type { LibraryVariant } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { Dialog } from '../../../components/ui/dialog';
import { Notice } from '../../../components/ui/page';
import { useDeleteVariant } from '../api/use-delete-variant';

export function DeleteVariantDialog({
  variant,
  onClose,
  onDone,
}: {
  variant: LibraryVariant | null;
  onClose: () => void;
  onDone: (message: string) => void;
}) {
  const remove = useDeleteVariant();
  const confirm = async () => {
    if (!variant) return;
    const result = await remove.mutateAsync(variant.id);
    onDone(
      result.result === 'archived'
        ? `${variant.name} is archived: it no longer appears in the library or on the board, and past weeks still show it.`
        : `${variant.name} was deleted.`,
    );
  };
  return (
    <Dialog open={variant !== null} onClose={onClose} title={variant ? `Delete ${variant.name}?` : ''} size="sm">
      {variant ? (
        <div className="flex flex-col gap-4">
          {remove.error ? <Notice tone="error">{remove.error.message}</Notice> : null}
          <p>
            {variant.inHistory
              ? 'An athlete has already planned or lifted it, so it will be archived instead: hidden from the library and the board, still shown in the history. You can show archived variants and restore it later.'
              : 'Nobody has planned or lifted it yet, so it will be removed for good.'}
          </p>
          <div className="flex justify-end gap-2">
            <Button variant="secondary" onClick={onClose}>
              Keep it
            </Button>
            <Button variant="danger" onClick={confirm} disabled={remove.isPending}>
              {variant.inHistory ? 'Archive' : 'Delete'}
            </Button>
          </div>
        </div>
      ) : null}
    </Dialog>
  );
}
