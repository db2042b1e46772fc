// The training-week settings beside the sessions: back-off sets after each max-effort top set, and how the
// accessories rotate (how long a block lasts, and how long before an accessory may come back).
import { useWatch, type UseFormReturn } from 'react-hook-form';
import { BACK_OFF_DROP_MAX, BACK_OFF_DROP_MIN, BACK_OFF_SETS_MAX, backOffSets } from '../../../../shared/calc';
import { weeks } from '../../../../shared/engine/words';
import { ACCESSORY_BLOCK_MAX, ACCESSORY_REPEAT_MAX, type TeamRulesBody } from '../../../../shared/schemas';
import { TextField } from '../../../components/ui/field';
import { RuleRow, RuleSection } from './rule-row';

type Form = UseFormReturn<TeamRulesBody>;
const num = (v: unknown) => (v === '' || v === null || v === undefined ? Number.NaN : Number(v));
const whole = (v: unknown): number | null => (Number.isInteger(v) ? Number(v) : null);

/** An example the coach can check: the back-off sets after a 180 kg top triple. */
function example(sets: number, drop: number): string {
  const [first] = backOffSets(180, 3, { sets, dropPct: drop });
  return `after 180 kg × 3, ${sets} × 3 at ${first!.weight} kg`;
}

export function BackOffSection({ form }: { form: Form }) {
  const [sets, drop] = useWatch({ control: form.control, name: ['rules.backOff.sets', 'rules.backOff.dropPct'] });
  const e = form.formState.errors.rules?.backOff;
  const n = whole(sets);
  const d = whole(drop);
  const dropOk = d !== null && d >= BACK_OFF_DROP_MIN && d <= BACK_OFF_DROP_MAX;
  const setsEffect =
    n === null || n < 0 || n > BACK_OFF_SETS_MAX
      ? `Enter a whole number of sets from 0 to ${BACK_OFF_SETS_MAX}.`
      : n === 0
        ? 'No back-off sets: the max-effort work ends with the top set.'
        : `After each max-effort top set, ${n} back-off set${n === 1 ? '' : 's'} at the top set's reps${
            dropOk ? ` (${example(n, d)})` : ''
          }. Athletes tick each one done on My week.`;
  return (
    <RuleSection
      title="Back-off sets"
      intro="Lighter sets after the max-effort top set, from the top set logged that day (or the suggested one until it is logged)."
    >
      <RuleRow effect={setsEffect}>
        <TextField
          label="Back-off sets after the top set"
          type="number"
          min={0}
          max={BACK_OFF_SETS_MAX}
          hint={`0 for none, at most ${BACK_OFF_SETS_MAX}`}
          error={e?.sets?.message}
          {...form.register('rules.backOff.sets', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow
        effect={
          dropOk
            ? `Each back-off set is ${d} % lighter than the top set, rounded down to the gym's 2.5 kg (5 lb) step. About 10 % is usual (common practice).`
            : `Enter a whole percentage from ${BACK_OFF_DROP_MIN} to ${BACK_OFF_DROP_MAX}: less is the top set again once rounded, more is light work rather than back-off work.`
        }
      >
        <TextField
          label="Back-off sets lighter by (%)"
          type="number"
          min={BACK_OFF_DROP_MIN}
          max={BACK_OFF_DROP_MAX}
          hint={`${BACK_OFF_DROP_MIN} to ${BACK_OFF_DROP_MAX} %`}
          error={e?.dropPct?.message}
          {...form.register('rules.backOff.dropPct', { setValueAs: num })}
        />
      </RuleRow>
    </RuleSection>
  );
}

export function AccessoryRotationSection({ form }: { form: Form }) {
  const [block, repeat] = useWatch({
    control: form.control,
    name: ['rules.accessoryRotation.blockWeeks', 'rules.accessoryRotation.repeatWindowWeeks'],
  });
  const e = form.formState.errors.rules?.accessoryRotation;
  const b = whole(block);
  const r = whole(repeat);
  return (
    <RuleSection
      title="Accessory rotation"
      intro="When a coach fills an athlete's accessories from the library, these windows choose them."
    >
      <RuleRow
        effect={
          b !== null && b >= 1 && b <= ACCESSORY_BLOCK_MAX
            ? `The same accessories for ${weeks(b)}, then the next ones.`
            : `Enter a whole number of weeks from 1 to ${ACCESSORY_BLOCK_MAX}.`
        }
      >
        <TextField
          label="Accessories change every (weeks)"
          type="number"
          min={1}
          max={ACCESSORY_BLOCK_MAX}
          error={e?.blockWeeks?.message}
          {...form.register('rules.accessoryRotation.blockWeeks', { setValueAs: num })}
        />
      </RuleRow>
      <RuleRow
        effect={
          r === null || r < 1 || r > ACCESSORY_REPEAT_MAX
            ? `Enter a whole number of weeks from 1 to ${ACCESSORY_REPEAT_MAX}.`
            : b !== null && r < b
              ? `Shorter than a block: the form will not save it. Use at least ${weeks(b)}.`
              : `An accessory done in the last ${weeks(r)} before a block does not come back in it (unless the library has no other).`
        }
      >
        <TextField
          label="Same accessory again after (weeks)"
          type="number"
          min={1}
          max={ACCESSORY_REPEAT_MAX}
          hint="At least as long as a block"
          error={e?.repeatWindowWeeks?.message}
          {...form.register('rules.accessoryRotation.repeatWindowWeeks', { setValueAs: num })}
        />
      </RuleRow>
    </RuleSection>
  );
}
