// Week ranges in plan queries: malformed weeks get field messages, never an exception.
import { describe, expect, it } from 'vitest';
import { boardQuery, planListQuery } from '../../../shared/schemas';

describe('plan week ranges', () => {
  it('answers malformed weeks with field errors instead of throwing', () => {
    for (const [from, to] of [
      ['16', '36412'],
      ['%00', '1e309'],
      ['2027-W05', '<script>'],
      ['😀', '2027-W05'],
    ]) {
      const list = planListQuery.safeParse({ from, to });
      expect(list.success).toBe(false);
      const board = boardQuery.safeParse({ from, to });
      expect(board.success).toBe(false);
    }
  });

  it('still measures the span between two real weeks', () => {
    expect(boardQuery.safeParse({ from: '2027-W10', to: '2027-W05' }).success).toBe(false);
    expect(boardQuery.safeParse({ from: '2027-W05', to: '2027-W10' }).success).toBe(true);
  });
});
