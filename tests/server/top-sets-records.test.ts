// The day a top set counts for, on its own (the record maths is tested with shared/calc).
import { describe, expect, it } from 'vitest';
import { performedOnFor } from '../../server/modules/top-sets/top-sets.service';

describe('performedOnFor', () => {
  it('is today inside the week, else the nearest end of the week', () => {
    expect(performedOnFor('2027-W10', new Date('2027-03-10T18:00:00Z'))).toBe('2027-03-10');
    expect(performedOnFor('2027-W10', new Date('2027-03-20T08:00:00Z'))).toBe('2027-03-14');
    expect(performedOnFor('2027-W10', new Date('2027-03-01T08:00:00Z'))).toBe('2027-03-08');
  });
});
