// A save refused as stale: the other person's edit is loaded into the form and the message names the
// fields whose changes of this user were lost; any other error is left to the caller.
import { describe, expect, it } from 'vitest';
import { ApiError } from '../../../src/lib/api-client';
import { loadTheirEdit } from '../../../src/lib/form-errors';

interface Row {
  id: number;
  name: string;
  sets: number;
}
const valuesOf = (r: Row) => ({ name: r.name, sets: r.sets });

function fakeForm(values: { name: string; sets: number }) {
  let current = values;
  return { getValues: () => current, reset: (v: typeof values) => (current = v), now: () => current };
}

describe('loadTheirEdit', () => {
  it('loads the stored row and names the fields this user changed', () => {
    const form = fakeForm({ name: 'Mine', sets: 3 });
    const theirs: Row = { id: 1, name: 'Theirs', sets: 3 };
    const err = new ApiError(409, 'stale_version', 'Someone else saved this first.', {}, {
      code: 'stale_version',
      message: 'Someone else saved this first.',
      current: theirs,
    } as never);
    const got = loadTheirEdit(err, form, valuesOf);
    expect(got).toEqual({
      row: theirs,
      message: 'Someone else saved this first. Your changes to name were not saved.',
    });
    expect(form.now()).toEqual({ name: 'Theirs', sets: 3 });
  });

  it('leaves any other error, and a 409 without the stored row, to the caller', () => {
    const form = fakeForm({ name: 'Mine', sets: 3 });
    expect(loadTheirEdit(new ApiError(400, 'invalid', 'Bad', { name: ['x'] }), form, valuesOf)).toBeNull();
    expect(loadTheirEdit(new ApiError(409, 'stale_version', 'Stale'), form, valuesOf)).toBeNull();
    expect(loadTheirEdit(new Error('network'), form, valuesOf)).toBeNull();
    expect(form.now()).toEqual({ name: 'Mine', sets: 3 });
  });
});
