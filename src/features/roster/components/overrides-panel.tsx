// This athlete's own rotation windows and joint budgets, on top of the team's; an empty field keeps
// the team's value, and each field says what the value in force does.
import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import { JOINTS } from '../../../../shared/engine/types';
import { jointName, weeks } from '../../../../shared/engine/words';
import { athleteRuleOverridesSchema, type Athlete, type TeamRules } from '../../../../shared/schemas';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { isApiError } from '../../../lib/api-client';
import { staleSaveCurrent } from '../../../lib/api-refusals';
import { applyFieldErrors } from '../../../lib/form-errors';
import { useUpdateAthlete } from '../api/use-save-athlete';
import { capital } from './labels';
import { Panel } from './panel';

const optionalNum = (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v));

/** Drops untouched joints so an empty budget object does not count as an override. */
function clean(o: { jointBudget?: Record<string, number | undefined> | undefined } & Record<string, unknown>) {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(o)) if (v !== undefined && k !== 'jointBudget') out[k] = v;
  const budget = Object.fromEntries(Object.entries(o.jointBudget ?? {}).filter(([, v]) => v !== undefined));
  if (Object.keys(budget).length) out.jointBudget = budget;
  return out;
}

const WINDOWS = [
  {
    name: 'repeatWindowWeeks',
    label: 'Same variant after (weeks)',
    effect: (w: string) => `a variant at most once in any ${w}.`,
  },
  {
    name: 'familyWindowWeeks',
    label: 'Same family after (weeks)',
    effect: (w: string) => `a family at most once in any ${w}.`,
  },
  { name: 'jointWindowWeeks', label: 'Budget span (weeks)', effect: (w: string) => `budgets count any ${w}.` },
] as const;

export function OverridesPanel({
  athlete,
  team,
  onConflict,
}: {
  athlete: Athlete;
  team: TeamRules;
  onConflict: (current: Athlete, message: string) => void;
}) {
  const update = useUpdateAthlete();
  const form = useForm({
    resolver: zodResolver(athleteRuleOverridesSchema),
    defaultValues: { ...athlete.ruleOverrides, jointBudget: { ...(athlete.ruleOverrides.jointBudget ?? {}) } },
  });
  const v = useWatch({ control: form.control });
  const { errors } = form.formState;
  const span = v.jointWindowWeeks ?? team.jointWindowWeeks;
  const own = (x: unknown) => (x === undefined ? 'Team rule: ' : 'Own rule: ');

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await update.mutateAsync({ id: athlete.id, body: { ruleOverrides: clean(values), version: athlete.version } });
    } catch (err) {
      const theirs = staleSaveCurrent<Athlete>(err);
      if (theirs && isApiError(err)) {
        onConflict(theirs, err.message);
        return;
      }
      applyFieldErrors(err, form.setError, (f) => f.replace(/^ruleOverrides\./, ''));
    }
  });

  const windowField = (
    name: 'repeatWindowWeeks' | 'familyWindowWeeks' | 'jointWindowWeeks',
    label: string,
    teamValue: number,
  ) => (
    <TextField
      label={label}
      type="number"
      min={1}
      max={name === 'jointWindowWeeks' ? 12 : 26}
      placeholder={`Team: ${teamValue}`}
      error={errors[name]?.message}
      {...form.register(name, { setValueAs: optionalNum })}
    />
  );

  return (
    <Panel title="Own rules">
      <form onSubmit={onSubmit} noValidate aria-label="Own rules" className="flex flex-col gap-3">
        <p className="text-sm text-ink-600">Leave a field empty to follow the team rule shown in it.</p>
        <div className="grid gap-3 sm:grid-cols-3">
          {WINDOWS.map((w) => (
            <div key={w.name}>
              {windowField(w.name, w.label, team[w.name])}
              <p className="mt-1 text-sm text-ink-700">
                {own(v[w.name])}
                {w.effect(weeks(v[w.name] ?? team[w.name]))}
              </p>
            </div>
          ))}
        </div>
        <fieldset className="grid gap-3 sm:grid-cols-3">
          <legend className="mb-1 text-sm font-semibold text-ink-800">Joint budgets (stress points per span)</legend>
          {JOINTS.map((j) => {
            const mine = v.jointBudget?.[j];
            const cap = mine ?? team.jointBudget[j];
            return (
              <div key={j}>
                <TextField
                  label={capital(jointName(j))}
                  type="number"
                  min={0}
                  max={60}
                  placeholder={team.jointBudget[j] === undefined ? 'Team: no cap' : `Team: ${team.jointBudget[j]}`}
                  error={errors.jointBudget?.[j]?.message}
                  {...form.register(`jointBudget.${j}`, { setValueAs: optionalNum })}
                />
                <p className="mt-1 text-sm text-ink-700">
                  {own(mine)}
                  {cap === undefined ? 'no cap.' : `at most ${cap} in any ${weeks(span)}.`}
                </p>
              </div>
            );
          })}
        </fieldset>
        {update.error && !isApiError(update.error, 409) && !Object.keys(errors).length ? (
          <p role="alert" className="text-sm text-breach-700">
            {update.error.message}
          </p>
        ) : null}
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={() => form.reset({ jointBudget: {} }, { keepDefaultValues: true })}>
            Clear all
          </Button>
          <Button type="submit" disabled={!form.formState.isDirty || form.formState.isSubmitting}>
            Save own rules
          </Button>
        </div>
      </form>
    </Panel>
  );
}
