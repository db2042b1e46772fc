// The board's engine view: athletes grouped by their own rules, warnings and loads per cell, live drop
// ratings (a moved pick leaves its cell), rule breaks after a swap, and reuse of unchanged parts.
import { describe, expect, it } from 'vitest';
import {
  breaksAfter,
  buildBoardModel,
  cellKey,
  prepareRatings,
  rateTargets,
} from '../../../src/features/board/model/board-model';
import { CURRENT, entry, snapshot, wk } from './fixtures';

describe('buildBoardModel', () => {
  it('groups athletes by their effective rules, one engine request per group', () => {
    const m = buildBoardModel(snapshot());
    expect(m.groups).toHaveLength(2);
    expect(m.groupOf.get(1)!.rules.repeatWindowWeeks).toBe(8);
    expect(m.groupOf.get(2)!.rules.repeatWindowWeeks).toBe(6);
    expect(m.groupOf.get(1)!.request.athletes.map((a) => a.id)).toEqual(['1']);
  });

  it('targets only this week and later, every athlete and slot', () => {
    const m = buildBoardModel(snapshot());
    expect(m.editableFrom).toBe(CURRENT);
    expect(m.targets).toHaveLength(2 * 4 * 2);
    expect(m.targets.every((t) => t.week >= CURRENT)).toBe(true);
  });

  it('marks a pick that breaks a rule, in plain words, and only that one', () => {
    const m = buildBoardModel(snapshot([entry(1, wk(1), 'upper', 5), entry(2, wk(1), 'upper', 5)]));
    expect(m.warnings(cellKey(1, wk(1), 'upper'))![0]).toMatch(/elbow stress 3 over this athlete's limit of 1/);
    expect(m.warnings(cellKey(2, wk(1), 'upper'))).toBeUndefined();
  });

  it('gives each athlete a joint load per visible week against the budget', () => {
    const m = buildBoardModel(snapshot([entry(2, wk(0), 'lower', 3), entry(2, wk(1), 'lower', 3, { pinned: true })]));
    const bo = m.view(2);
    expect(bo.loads).toHaveLength(m.weeks.length);
    const knee = (i: number) => bo.loads[i]!.find((p) => p.joint === 'knee')!;
    const at = m.weeks.indexOf(wk(1));
    // Front squat loads the knee 2 in each of the two weeks; the default knee budget is 10 over 4 weeks.
    expect(knee(at)).toMatchObject({ load: 4, budget: 10, ratio: 0.4 });
    expect(bo.peak).toMatchObject({ joint: 'knee', ratio: 0.4 });
  });

  it('keeps what did not change when rebuilt from the previous model', () => {
    const first = snapshot([entry(1, wk(1), 'upper', 5), entry(2, wk(1), 'lower', 1)]);
    const a = buildBoardModel(first);
    // The grid has drawn both rows, so both athletes' facts were worked out.
    a.view(1);
    a.view(2);
    const changed = { ...first, entries: [first.entries[0]!, entry(2, wk(1), 'lower', 2)] };
    const b = buildBoardModel(changed, a);
    expect(b.warnings(cellKey(1, wk(1), 'upper'))).toBe(a.warnings(cellKey(1, wk(1), 'upper')));
    expect(b.view(1)).toBe(a.view(1));
    expect(b.view(2)).not.toBe(a.view(2));
    expect(b.targets).toBe(a.targets);
  });
});

describe('drop ratings', () => {
  it('judges each athlete by their own rules: a repeat within eight weeks breaks only for the athlete with that window', () => {
    // Box squat seven weeks before this week, for both athletes.
    const data = snapshot(
      [],
      [
        { athleteId: 1, week: wk(-7), slotId: 'lower', variantId: 1, pinned: false },
        { athleteId: 2, week: wk(-7), slotId: 'lower', variantId: 1, pinned: false },
      ],
    );
    const r = rateTargets(buildBoardModel(data), { kind: 'library', variantId: 1 });
    const ada = r.get(cellKey(1, wk(0), 'lower'))!;
    expect(ada.status).toBe('break');
    expect(ada.breaks.join()).toMatch(/Box squat/);
    expect(r.get(cellKey(2, wk(0), 'lower'))!.status).not.toBe('break');
  });

  it('rates the wrong lift for a slot, and leaves past weeks out', () => {
    const m = buildBoardModel(snapshot());
    const ratings = prepareRatings(m, { kind: 'library', variantId: 1 });
    expect(ratings.get(cellKey(2, wk(1), 'upper'))!.status).toBe('wrongLift');
    expect(ratings.get(cellKey(2, wk(1), 'lower'))!.status).toBe('clean');
    expect(ratings.get(cellKey(2, wk(-1), 'lower'))).toBeUndefined();
  });

  it('takes a dragged pick off its own cell: moving it a week on is no repeat', () => {
    const pick = entry(2, wk(1), 'lower', 2);
    const m = buildBoardModel(snapshot([pick]));
    const fromLibrary = rateTargets(m, { kind: 'library', variantId: 2 });
    expect(fromLibrary.get(cellKey(2, wk(2), 'lower'))!.status).toBe('break');
    const moving = rateTargets(m, {
      kind: 'cell',
      cell: { athleteId: 2, week: wk(1), slotId: 'lower' },
      variantId: 2,
      entry: pick,
    });
    expect(moving.get(cellKey(2, wk(2), 'lower'))!.status).not.toBe('break');
    expect(moving.get(cellKey(2, wk(1), 'lower'))!.status).toBe('source');
  });

  it('works out a cell only once per drag', () => {
    const m = buildBoardModel(snapshot());
    const ratings = prepareRatings(m, { kind: 'library', variantId: 3 });
    const key = cellKey(1, wk(2), 'lower');
    expect(ratings.get(key)).toBe(ratings.get(key));
  });
});

describe('breaksAfter', () => {
  it('reports the rules a swap would break, on the changed cells only', () => {
    const m = buildBoardModel(snapshot([entry(1, wk(1), 'upper', 4), entry(2, wk(1), 'upper', 5)]));
    const breaks = breaksAfter(m, [
      { cell: { athleteId: 1, week: wk(1), slotId: 'upper' }, variantId: 5 },
      { cell: { athleteId: 2, week: wk(1), slotId: 'upper' }, variantId: 4 },
    ]);
    expect([...breaks.keys()]).toEqual([cellKey(1, wk(1), 'upper')]);
    expect(breaks.get(cellKey(1, wk(1), 'upper'))![0]).toMatch(/elbow/);
  });
});
