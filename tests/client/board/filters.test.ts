// The board's athlete filters: name, meet ahead (any or within N weeks), restriction and "needs a look".
import { describe, expect, it } from 'vitest';
import { buildBoardModel, cellKey } from '../../../src/features/board/model/board-model';
import { NO_FILTER, filterAthletes, isFiltering, restrictionTags } from '../../../src/features/board/model/filters';
import { restrictionTag } from '../../../shared/planning/words';
import { entry, snapshot, wk } from './fixtures';

const names = (list: { name: string }[]) => list.map((a) => a.name);

function withMeet(weeksOut: number) {
  const data = snapshot();
  data.athletes[1] = {
    ...data.athletes[1]!,
    meet: { id: 9, name: 'Invented Open', date: '2027-04-01', week: wk(weeksOut) },
  };
  return buildBoardModel(data);
}

describe('filterAthletes', () => {
  it('shows everyone with no filter, the same list', () => {
    const m = buildBoardModel(snapshot());
    expect(isFiltering(NO_FILTER)).toBe(false);
    expect(filterAthletes(m, NO_FILTER, new Set())).toBe(m.athletes);
  });

  it('finds athletes by part of their name, in any case', () => {
    const m = buildBoardModel(snapshot());
    expect(names(filterAthletes(m, { ...NO_FILTER, name: ' bO ' }, new Set()))).toEqual(['Bo']);
    expect(filterAthletes(m, { ...NO_FILTER, name: 'nobody' }, new Set())).toEqual([]);
  });

  it('keeps athletes with a meet ahead, or one within N weeks of this week', () => {
    const m = withMeet(3);
    expect(names(filterAthletes(m, { ...NO_FILTER, meet: 'meet' }, new Set()))).toEqual(['Bo']);
    expect(names(filterAthletes(m, { ...NO_FILTER, meet: 4 }, new Set()))).toEqual(['Bo']);
    expect(names(filterAthletes(m, { ...NO_FILTER, meet: 3 }, new Set()))).toEqual(['Bo']);
    expect(filterAthletes(m, { ...NO_FILTER, meet: 2 }, new Set())).toEqual([]);
    // A meet already behind does not count.
    expect(filterAthletes(withMeet(-1), { ...NO_FILTER, meet: 'meet' }, new Set())).toEqual([]);
  });

  it('keeps athletes with any restriction, or with one in particular', () => {
    const m = buildBoardModel(snapshot());
    const tags = restrictionTags(m.athletes);
    expect(tags).toEqual([restrictionTag(m.athletes[0]!.restrictions[0]!)]);
    expect(names(filterAthletes(m, { ...NO_FILTER, restriction: '*' }, new Set()))).toEqual(['Ada']);
    expect(names(filterAthletes(m, { ...NO_FILTER, restriction: tags[0]! }, new Set()))).toEqual(['Ada']);
    expect(filterAthletes(m, { ...NO_FILTER, restriction: 'no such tag' }, new Set())).toEqual([]);
  });

  it('keeps only athletes with a pick that needs a look, or a cell the last save changed', () => {
    // Variant 5 breaks Ada's elbow restriction; Bo's pick of it is clean.
    const m = buildBoardModel(snapshot([entry(1, wk(1), 'upper', 5), entry(2, wk(1), 'upper', 5)]));
    const look = { ...NO_FILTER, needsALook: true };
    expect(names(filterAthletes(m, look, new Set()))).toEqual(['Ada']);
    expect(names(filterAthletes(m, look, new Set([cellKey(2, wk(2), 'lower')])))).toEqual(['Ada', 'Bo']);
    // Filters add up.
    expect(filterAthletes(m, { ...look, name: 'bo' }, new Set())).toEqual([]);
  });
});
