// The head coach's rules: max-effort slots, rotation windows, joint budgets, taper steps, the bodyweight
// caution, connective-tissue settings and the gym's equipment, each with what its value does beside it.
import { LIFT_LABEL, RISK_LABEL } from '../../../../shared/labels';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useController, useFieldArray, useForm, useWatch, type Control, type UseFormReturn } from 'react-hook-form';
import { JOINTS, LIFTS, type Joint } from '../../../../shared/engine/types';
import { jointName, weeks } from '../../../../shared/engine/words';
import { teamRulesBody, type TeamRulesBody, type TeamRulesDoc } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { AddItemField, CheckboxGroup } from '../../../components/ui/choices';
import { LabelledOptions, SelectField, TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/page';
import { isApiError } from '../../../lib/api-client';
import { staleSaveCurrent } from '../../../lib/api-refusals';
import { applyFieldErrors } from '../../../lib/form-errors';
import { useSaveRules } from '../api/use-save-rules';
import { RuleRow, RuleSection } from './rule-row';
import { SessionsSection } from './sessions-section';
import { AccessoryRotationSection, BackOffSection } from './week-work-section';

type Form = UseFormReturn<TeamRulesBody>;
const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
const num = (v: unknown) => (v === '' || v === null || v === undefined ? Number.NaN : Number(v));
const optionalNum = (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v));

function toValues(doc: TeamRulesDoc): TeamRulesBody {
  return { rules: structuredClone(doc.rules), equipment: [...doc.equipment], version: doc.version };
}

export function RulesForm({ doc }: { doc: TeamRulesDoc }) {
  const save = useSaveRules();
  const [saved, setSaved] = useState<TeamRulesDoc>(doc);
  const [notice, setNotice] = useState<{ tone: 'success' | 'error'; text: string } | null>(null);
  const form = useForm({ resolver: zodResolver(teamRulesBody), defaultValues: toValues(doc) });
  const { errors, isSubmitting, isDirty } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    setNotice(null);
    try {
      const next = await save.mutateAsync(values);
      setSaved(next);
      form.reset(toValues(next));
      setNotice({ tone: 'success', text: 'The rules are saved. The board uses them from its next fill.' });
    } catch (err) {
      const theirs = staleSaveCurrent<TeamRulesDoc>(err);
      if (theirs && isApiError(err)) {
        setSaved(theirs);
        form.reset(toValues(theirs));
        setNotice({ tone: 'error', text: err.message });
        return;
      }
      if (!applyFieldErrors(err, form.setError)) {
        setNotice({ tone: 'error', text: err instanceof Error ? err.message : 'The rules could not be saved.' });
      }
    }
  });

  const savedSlotIds = new Set(saved.rules.slots.map((s) => s.id));
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Team rules">
      {notice ? <Notice tone={notice.tone}>{notice.text}</Notice> : null}
      {Object.keys(errors).length > 0 ? (
        <Notice tone="error">Some settings need attention: they are marked below.</Notice>
      ) : null}
      <Slots form={form} savedIds={savedSlotIds} />
      <SessionsSection form={form} />
      <BackOffSection form={form} />
      <AccessoryRotationSection form={form} />
      <Windows form={form} />
      <Budgets form={form} />
      <Balance form={form} />
      <Taper form={form} />
      <Bodyweight form={form} />
      <Tissue form={form} />
      <Equipment control={form.control} error={errors.equipment?.message ?? errors.equipment?.[0]?.message} />
      <div className="sticky bottom-0 -mx-3 flex flex-wrap items-center justify-end gap-3 border-t border-chalk-300 bg-chalk-100/95 px-3 py-3">
        <span className="text-sm text-ink-600">
          {saved.updatedBy && saved.updatedAt
            ? `Last saved by ${saved.updatedBy.name}, ${new Date(saved.updatedAt).toLocaleString()}`
            : 'Team defaults: not saved yet'}
        </span>
        <Button variant="secondary" disabled={!isDirty || isSubmitting} onClick={() => form.reset(toValues(saved))}>
          Undo changes
        </Button>
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Save rules'}
        </Button>
      </div>
    </form>
  );
}

function Slots({ form, savedIds }: { form: Form; savedIds: Set<string> }) {
  const { fields, append, remove } = useFieldArray({ control: form.control, name: 'rules.slots' });
  const slots = useWatch({ control: form.control, name: 'rules.slots' }) ?? [];
  const errors = form.formState.errors.rules?.slots;
  return (
    <RuleSection
      title="Max-effort slots"
      intro="Each slot is one heavy top set a week for every athlete."
      actions={
        fields.length < 4 ? (
          <Button
            size="sm"
            variant="secondary"
            onClick={() => append({ id: `slot-${fields.length + 1}`, label: '', lifts: ['squat'] })}
          >
            Add slot
          </Button>
        ) : null
      }
    >
      {errors?.message ? <p className="text-sm text-breach-700">{errors.message}</p> : null}
      {fields.map((f, i) => {
        const slot = slots[i];
        const lifts = slot?.lifts ?? [];
        return (
          <RuleRow
            key={f.id}
            effect={
              lifts.length
                ? `Every week each athlete gets one ${lifts.map((l) => LIFT_LABEL[l].toLowerCase()).join(' or ')} variant in “${slot?.label || 'this slot'}”.`
                : 'Pick at least one lift: the slot takes only variants of the lifts ticked.'
            }
          >
            <div className="flex flex-col gap-2">
              <TextField
                label="Slot name"
                error={errors?.[i]?.label?.message}
                {...form.register(`rules.slots.${i}.label`)}
              />
              {savedIds.has(f.id) || savedIds.has(slot?.id ?? '') ? (
                <p className="text-sm text-ink-600">
                  Id <code>{slot?.id}</code> (past plans refer to it, so it stays)
                </p>
              ) : (
                <TextField
                  label="Slot id"
                  hint="Lower-case letters, digits and dashes"
                  error={errors?.[i]?.id?.message}
                  {...form.register(`rules.slots.${i}.id`)}
                />
              )}
              <LiftPicker control={form.control} index={i} error={errors?.[i]?.lifts?.message} />
              {fields.length > 1 ? (
                <Button size="sm" variant="ghost" className="self-start" onClick={() => remove(i)}>
                  Remove this slot
                </Button>
              ) : null}
            </div>
          </RuleRow>
        );
      })}
    </RuleSection>
  );
}

function LiftPicker({
  control,
  index,
  error,
}: {
  control: Control<TeamRulesBody>;
  index: number;
  error?: string | undefined;
}) {
  const { field } = useController({ control, name: `rules.slots.${index}.lifts` });
  return (
    <fieldset>
      <legend className="text-sm font-semibold text-ink-800">Lifts</legend>
      <CheckboxGroup options={LIFTS} value={field.value ?? []} onChange={field.onChange} label={cap} />
      {error ? <p className="text-sm font-medium text-breach-700">{error}</p> : null}
    </fieldset>
  );
}

function Windows({ form }: { form: Form }) {
  const [repeat, family, joint] = useWatch({
    control: form.control,
    name: ['rules.repeatWindowWeeks', 'rules.familyWindowWeeks', 'rules.jointWindowWeeks'],
  });
  const e = form.formState.errors.rules;
  const n = (v: unknown) => (Number.isFinite(v) ? Number(v) : null);
  return (
    <RuleSection title="Rotation windows">
      <RuleRow
        effect={
          n(repeat)
            ? `An exact variant comes back at most once in any ${weeks(n(repeat)!)} in a row.`
            : 'Enter a number of weeks.'
        }
      >
        <TextField
          label="Same variant again after (weeks)"
          type="number"
          min={1}
          max={26}
          error={e?.repeatWindowWeeks?.message}
          {...form.register('rules.repeatWindowWeeks', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow
        effect={
          n(family)
            ? `Two variants of one family (two box squats, say) never fall within ${weeks(n(family)!)} in a row.`
            : 'Enter a number of weeks.'
        }
      >
        <TextField
          label="Same family again after (weeks)"
          type="number"
          min={1}
          max={26}
          error={e?.familyWindowWeeks?.message}
          {...form.register('rules.familyWindowWeeks', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow
        effect={
          n(joint)
            ? `The joint budgets below count the stress of any ${weeks(n(joint)!)} in a row.`
            : 'Enter a number of weeks.'
        }
      >
        <TextField
          label="Joint budget span (weeks)"
          type="number"
          min={1}
          max={12}
          error={e?.jointWindowWeeks?.message}
          {...form.register('rules.jointWindowWeeks', { setValueAs: num })}
        />
      </RuleRow>
    </RuleSection>
  );
}

function Budgets({ form }: { form: Form }) {
  const budget = useWatch({ control: form.control, name: 'rules.jointBudget' }) ?? {};
  const span = useWatch({ control: form.control, name: 'rules.jointWindowWeeks' });
  const spanText = Number.isFinite(span) ? weeks(Number(span)) : 'the span';
  const e = form.formState.errors.rules?.jointBudget;
  return (
    <RuleSection
      title="Joint budgets"
      intro="Each top set loads a joint 0 (not at all) to 3 (heavily); the budget caps the sum per joint."
    >
      {JOINTS.map((j: Joint) => {
        const v = budget[j];
        return (
          <RuleRow
            key={j}
            effect={
              v === undefined || !Number.isFinite(v)
                ? `No cap: the ${jointName(j)} may take any load.`
                : `The ${jointName(j)} takes at most ${v} stress points in any ${spanText} (one heavy variant is 3).`
            }
          >
            <TextField
              label={`${cap(jointName(j))} budget`}
              type="number"
              min={0}
              max={60}
              placeholder="No cap"
              error={e?.[j]?.message}
              {...form.register(`rules.jointBudget.${j}`, { setValueAs: optionalNum })}
            />
          </RuleRow>
        );
      })}
    </RuleSection>
  );
}

function Balance({ form }: { form: Form }) {
  const [comfort, balance, slots] = useWatch({
    control: form.control,
    name: ['rules.comfortRatio', 'rules.liftBalanceWeeks', 'rules.slots'],
  });
  const e = form.formState.errors.rules;
  const mixed = (slots ?? []).filter((s) => (s?.lifts?.length ?? 0) > 1).map((s) => s?.label || s?.id);
  return (
    <RuleSection title="Comfort and lift balance" intro="How the board chooses among picks that keep every rule above.">
      <RuleRow
        effect={
          Number.isFinite(comfort)
            ? `Whenever the library allows, every joint stays at or under ${Math.round(Number(comfort) * 100)}% of its budget; below that line a lighter variant is not preferred to a heavier one.`
            : 'Enter a share of the budget from 0.5 to 1.'
        }
      >
        <TextField
          label="Comfortable share of a joint budget"
          type="number"
          min={0.5}
          max={1}
          step={0.05}
          error={e?.comfortRatio?.message}
          {...form.register('rules.comfortRatio', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow
        effect={
          !Number.isFinite(balance)
            ? 'Enter a number of weeks.'
            : mixed.length
              ? `${mixed.join(' and ')}: each of its lifts comes up at least once in any ${weeks(Number(balance))} in a row, when the athlete has a variant for it.`
              : `No slot takes several lifts, so this has no effect now; a mixed slot would hold each lift at least once in any ${weeks(Number(balance))} in a row.`
        }
      >
        <TextField
          label="Each lift of a mixed slot within (weeks)"
          type="number"
          min={2}
          max={12}
          error={e?.liftBalanceWeeks?.message}
          {...form.register('rules.liftBalanceWeeks', { setValueAs: num })}
        />
      </RuleRow>
    </RuleSection>
  );
}

function Taper({ form }: { form: Form }) {
  const { fields, append, remove } = useFieldArray({ control: form.control, name: 'rules.taper' });
  const steps = useWatch({ control: form.control, name: 'rules.taper' }) ?? [];
  const e = form.formState.errors.rules?.taper;
  return (
    <RuleSection
      title="Taper before a meet"
      intro="Steps overlap: in a week inside several steps, every one of them applies."
      actions={
        fields.length < 8 ? (
          <Button size="sm" variant="secondary" onClick={() => append({ weeksOut: 2, maxRisk: 2 })}>
            Add taper step
          </Button>
        ) : null
      }
    >
      {fields.length === 0 ? (
        <p className="py-2 text-ink-600">No taper: the meet changes nothing on the board.</p>
      ) : null}
      {fields.map((f, i) => {
        const s = steps[i];
        const out = Number(s?.weeksOut);
        const spec = s?.minSpecificity;
        const effect = Number.isFinite(out)
          ? `${out === 0 ? 'In the meet week' : `From ${weeks(out)} out up to the meet`}, only variants of risk ${s?.maxRisk} or lower${
              spec !== undefined && Number.isFinite(spec) ? `, at least ${spec} close to the competition lift` : ''
            }.`
          : 'Enter how many weeks before the meet this step starts.';
        return (
          <RuleRow key={f.id} effect={effect} wide>
            <div className="grid grid-cols-3 gap-2">
              <TextField
                label="Weeks out"
                type="number"
                min={0}
                max={16}
                error={e?.[i]?.weeksOut?.message}
                {...form.register(`rules.taper.${i}.weeksOut`, { setValueAs: num })}
              />
              <SelectField
                label="Highest risk"
                error={e?.[i]?.maxRisk?.message}
                {...form.register(`rules.taper.${i}.maxRisk`, { setValueAs: num })}
              >
                <LabelledOptions labels={RISK_LABEL} />
              </SelectField>
              <TextField
                label="Min. specificity"
                type="number"
                step="0.05"
                min={0}
                max={1}
                placeholder="Any"
                error={e?.[i]?.minSpecificity?.message}
                {...form.register(`rules.taper.${i}.minSpecificity`, { setValueAs: optionalNum })}
              />
            </div>
            <Button size="sm" variant="ghost" className="mt-1" onClick={() => remove(i)}>
              Remove this step
            </Button>
          </RuleRow>
        );
      })}
    </RuleSection>
  );
}

function Bodyweight({ form }: { form: Form }) {
  const kg = useWatch({ control: form.control, name: 'rules.bodyweightGainCautionKg' });
  return (
    <RuleSection title="Bodyweight before a meet">
      <RuleRow
        effect={
          Number.isFinite(kg)
            ? `An athlete who gains more than ${kg} kg in the last 7 days before a meet sees a caution (rapid gain adds torque on tendons; common practice).`
            : 'Enter a weight in kg.'
        }
      >
        <TextField
          label="Caution above a 7-day gain of (kg)"
          type="number"
          step="0.1"
          min={0.1}
          max={10}
          error={form.formState.errors.rules?.bodyweightGainCautionKg?.message}
          {...form.register('rules.bodyweightGainCautionKg', { setValueAs: num })}
        />
      </RuleRow>
    </RuleSection>
  );
}

function Tissue({ form }: { form: Form }) {
  const t = useWatch({ control: form.control, name: 'rules.tissue' });
  const e = form.formState.errors.rules?.tissue;
  const pull = (n: number | undefined, what: string) =>
    n === undefined || !Number.isFinite(n)
      ? 'Enter a number of weeks, or -1.'
      : n < 0
        ? `${cap(what)} carry on right up to the meet.`
        : n === 0
          ? `No ${what} in the meet week.`
          : `No ${what} from ${weeks(n)} out up to the meet.`;
  return (
    <RuleSection title="Connective-tissue work" intro="Light tendon work each week, rotated between three kinds.">
      <RuleRow
        effect={
          Number.isFinite(t?.maxConsecutiveWeeks)
            ? `One kind runs at most ${weeks(Number(t?.maxConsecutiveWeeks))} in a row before another takes over.`
            : 'Enter a number of weeks.'
        }
      >
        <TextField
          label="Same kind at most (weeks in a row)"
          type="number"
          min={1}
          max={12}
          error={e?.maxConsecutiveWeeks?.message}
          {...form.register('rules.tissue.maxConsecutiveWeeks', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow effect={pull(t?.pullIsometricWeeksOut, 'isometric pulses')}>
        <TextField
          label="Stop isometrics (weeks out, -1 never)"
          type="number"
          min={-1}
          max={16}
          error={e?.pullIsometricWeeksOut?.message}
          {...form.register('rules.tissue.pullIsometricWeeksOut', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow effect={pull(t?.pullStretchWeeksOut, 'loaded stretches')}>
        <TextField
          label="Stop loaded stretch (weeks out, -1 never)"
          type="number"
          min={-1}
          max={16}
          error={e?.pullStretchWeeksOut?.message}
          {...form.register('rules.tissue.pullStretchWeeksOut', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow
        effect={
          Number.isFinite(t?.sorenessThreshold)
            ? `Next-day soreness of ${t?.sorenessThreshold}/10 or more after high-rep work makes the next dose lighter.`
            : 'Enter a number from 1 to 10.'
        }
      >
        <TextField
          label="Soreness that means too much (1–10)"
          type="number"
          min={1}
          max={10}
          error={e?.sorenessThreshold?.message}
          {...form.register('rules.tissue.sorenessThreshold', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow
        effect={
          Number.isFinite(t?.highRepMinReps)
            ? `High-rep light work is ${t?.highRepMinReps} reps; soreness makes the band lighter, never the reps fewer.`
            : 'Enter a number of reps, 100 or more.'
        }
      >
        <TextField
          label="High-rep work: reps (100 or more)"
          type="number"
          min={100}
          max={300}
          error={e?.highRepMinReps?.message}
          {...form.register('rules.tissue.highRepMinReps', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow
        effect={
          Number.isFinite(t?.sessionsPerWeek)
            ? `Each week's tissue work is done in ${t?.sessionsPerWeek} session${t?.sessionsPerWeek === 1 ? '' : 's'}, on separate days; three is usual.`
            : 'Enter a number of sessions from 1 to 7.'
        }
      >
        <TextField
          label="Sessions a week (1–7)"
          type="number"
          min={1}
          max={7}
          error={e?.sessionsPerWeek?.message}
          {...form.register('rules.tissue.sessionsPerWeek', { setValueAs: num })}
        />
      </RuleRow>
      <FocusJoints control={form.control} error={e?.focusJoints?.message} />
    </RuleSection>
  );
}

function FocusJoints({ control, error }: { control: Control<TeamRulesBody>; error?: string | undefined }) {
  const { field } = useController({ control, name: 'rules.tissue.focusJoints' });
  const value = field.value ?? [];
  return (
    <RuleRow
      effect={
        value.length
          ? `Tendon work goes to the ${value.map(jointName).join(', ')}, the most loaded of them first.`
          : 'No joints picked: no tendon work is prescribed.'
      }
    >
      <fieldset>
        <legend className="text-sm font-semibold text-ink-800">Joints for tendon work</legend>
        <CheckboxGroup
          className="grid grid-cols-2 gap-x-4"
          options={JOINTS}
          value={value}
          onChange={field.onChange}
          label={(j) => cap(jointName(j))}
        />
        {error ? <p className="text-sm font-medium text-breach-700">{error}</p> : null}
      </fieldset>
    </RuleRow>
  );
}

function Equipment({ control, error }: { control: Control<TeamRulesBody>; error?: string | undefined }) {
  const { field } = useController({ control, name: 'equipment' });
  const value = field.value ?? [];
  return (
    <RuleSection title="The gym's equipment">
      <RuleRow
        wide
        effect={`The board only picks variants whose equipment an athlete has; new athletes start with these ${value.length} items.`}
      >
        <ul className="mb-2 flex flex-wrap gap-2" aria-label="Equipment the gym has">
          {value.map((v) => (
            <li
              key={v}
              className="inline-flex items-center gap-1 rounded-full border border-ink-300 bg-chalk-100 py-0.5 pl-3 pr-1"
            >
              <span>{v}</span>
              <button
                type="button"
                aria-label={`Remove ${v}`}
                className="min-h-8 min-w-8 rounded-full text-lg leading-none hover:bg-chalk-300"
                onClick={() => field.onChange(value.filter((x) => x !== v))}
              >
                ×
              </button>
            </li>
          ))}
        </ul>
        <AddItemField
          label="Add equipment"
          onAdd={(item) => field.onChange(value.includes(item) ? value : [...value, item])}
        />
        {error ? <p className="text-sm font-medium text-breach-700">{error}</p> : null}
      </RuleRow>
    </RuleSection>
  );
}
