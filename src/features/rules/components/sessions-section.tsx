// The week's sessions in the rules: each a name, a day and its parts; a max-effort part names its slot and
// a speed part its lift. What each athlete does in them is set per athlete and week.
import { useController, useFieldArray, useWatch, type UseFormReturn } from 'react-hook-form';
import { SESSION_PARTS, SESSION_PART_LABELS, WEEKDAY_LABELS, type TeamRulesBody } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { CheckboxGroup } from '../../../components/ui/choices';
import { SelectField, TextField } from '../../../components/ui/field';
import { RuleRow, RuleSection } from './rule-row';

type Form = UseFormReturn<TeamRulesBody>;
type Part = (typeof SESSION_PARTS)[number];

function PartPicker({ form, index, error }: { form: Form; index: number; error?: string | undefined }) {
  const { field } = useController({ control: form.control, name: `rules.sessions.${index}.parts` });
  return (
    <fieldset>
      <legend className="text-sm font-semibold text-ink-800">Parts</legend>
      <CheckboxGroup<Part>
        options={SESSION_PARTS}
        value={(field.value ?? []) as Part[]}
        onChange={field.onChange}
        label={(p) => SESSION_PART_LABELS[p]}
      />
      {error ? <p className="text-sm text-breach-700">{error}</p> : null}
    </fieldset>
  );
}

const nullable = { setValueAs: (v: unknown) => (v === '' ? null : v) } as const;

export function SessionsSection({ form }: { form: Form }) {
  const { fields, append, remove } = useFieldArray({ control: form.control, name: 'rules.sessions' });
  const [sessions, slots] = useWatch({ control: form.control, name: ['rules.sessions', 'rules.slots'] });
  const errors = form.formState.errors.rules?.sessions;
  return (
    <RuleSection
      title="Sessions of the week"
      intro="The training days and what each holds. Speed work and accessories are set per athlete and week."
      actions={
        fields.length < 7 ? (
          <Button
            size="sm"
            variant="secondary"
            onClick={() =>
              append({
                id: `session-${fields.length + 1}`,
                name: '',
                weekday: Math.min(7, fields.length + 1),
                parts: ['accessories'],
                slotId: null,
                speedLift: null,
              })
            }
          >
            Add session
          </Button>
        ) : null
      }
    >
      {fields.map((f, i) => {
        const s = sessions?.[i];
        const parts = (s?.parts ?? []) as Part[];
        return (
          <RuleRow
            key={f.id}
            effect={`${WEEKDAY_LABELS[(s?.weekday ?? 1) - 1]}: ${parts.map((p) => SESSION_PART_LABELS[p].toLowerCase()).join(', ') || 'nothing yet'}.`}
          >
            <div className="flex flex-col gap-2">
              <TextField
                label="Session name"
                error={errors?.[i]?.name?.message}
                {...form.register(`rules.sessions.${i}.name`)}
              />
              <SelectField
                label="Day"
                error={errors?.[i]?.weekday?.message}
                {...form.register(`rules.sessions.${i}.weekday`, { valueAsNumber: true })}
              >
                {WEEKDAY_LABELS.map((d, n) => (
                  <option key={d} value={n + 1}>
                    {d}
                  </option>
                ))}
              </SelectField>
              <PartPicker form={form} index={i} error={errors?.[i]?.parts?.message} />
              {parts.includes('maxEffort') ? (
                <SelectField
                  label="Max-effort slot"
                  error={errors?.[i]?.slotId?.message}
                  {...form.register(`rules.sessions.${i}.slotId`, nullable)}
                >
                  <option value="">Pick a slot</option>
                  {(slots ?? []).map((slot) => (
                    <option key={slot.id} value={slot.id}>
                      {slot.label || slot.id}
                    </option>
                  ))}
                </SelectField>
              ) : null}
              {parts.includes('speed') ? (
                <SelectField
                  label="Speed lift"
                  error={errors?.[i]?.speedLift?.message}
                  {...form.register(`rules.sessions.${i}.speedLift`, nullable)}
                >
                  <option value="">Pick a lift</option>
                  <option value="squat">Squat</option>
                  <option value="bench">Bench press</option>
                  <option value="deadlift">Deadlift</option>
                </SelectField>
              ) : null}
              <Button size="sm" variant="ghost" className="self-start" onClick={() => remove(i)}>
                Remove this session
              </Button>
            </div>
          </RuleRow>
        );
      })}
    </RuleSection>
  );
}
