// What the athlete can train with: the gym's equipment ticked, plus anything of their own. The board
// never gives them a variant that needs something missing here.
import { zodResolver } from '@hookform/resolvers/zod';
import { useController, useForm } from 'react-hook-form';
import { z } from 'zod';
import { equipmentListSchema, type Athlete } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { AddItemField, CheckboxGroup } from '../../../components/ui/choices';
import { isApiError } from '../../../lib/api-client';
import { staleSaveCurrent } from '../../../lib/api-refusals';
import { useUpdateAthlete } from '../api/use-save-athlete';
import { Panel } from './panel';

const equipmentForm = z.object({ equipment: equipmentListSchema });

export function EquipmentPanel({
  athlete,
  gymEquipment,
  onConflict,
}: {
  athlete: Athlete;
  gymEquipment: string[];
  onConflict: (current: Athlete, message: string) => void;
}) {
  const update = useUpdateAthlete();
  const form = useForm({ resolver: zodResolver(equipmentForm), defaultValues: { equipment: athlete.equipment } });
  const { field } = useController({ control: form.control, name: 'equipment' });
  const value = field.value ?? [];
  const options = [...new Set([...gymEquipment, ...value])];
  const lacks = gymEquipment.filter((e) => !value.includes(e));
  const onSubmit = form.handleSubmit(async ({ equipment }) => {
    try {
      await update.mutateAsync({ id: athlete.id, body: { equipment, version: athlete.version } });
    } catch (err) {
      const theirs = staleSaveCurrent<Athlete>(err);
      if (theirs && isApiError(err)) onConflict(theirs, err.message);
    }
  });
  return (
    <Panel title="Equipment">
      <form onSubmit={onSubmit} noValidate aria-label="Equipment" className="flex flex-col gap-3">
        <fieldset>
          <legend className="sr-only">Equipment the athlete can use</legend>
          <CheckboxGroup
            className="grid grid-cols-1 gap-x-4 sm:grid-cols-2"
            options={options}
            value={value}
            onChange={field.onChange}
            label={(item) => (gymEquipment.includes(item) ? item : `${item} (own)`)}
          />
        </fieldset>
        <p className="text-sm text-ink-700">
          {lacks.length
            ? `Variants that need ${lacks.join(', ')} are never picked for this athlete.`
            : 'Every item the gym has is available to this athlete.'}
        </p>
        <AddItemField
          label="Add other equipment"
          onAdd={(item) => field.onChange(value.includes(item) ? value : [...value, item])}
        />
        {form.formState.errors.equipment ? (
          <p role="alert" className="text-sm text-breach-700">
            {form.formState.errors.equipment.message ?? 'Check the equipment names'}
          </p>
        ) : null}
        {update.error && !isApiError(update.error, 409) ? (
          <p role="alert" className="text-sm text-breach-700">
            {update.error.message}
          </p>
        ) : null}
        <div className="flex justify-end">
          <Button type="submit" disabled={!form.formState.isDirty || form.formState.isSubmitting}>
            Save equipment
          </Button>
        </div>
      </form>
    </Panel>
  );
}
