// One word per risk tier on every screen that names it (the library, the board's drawer, the rules).
import { describe, expect, it } from 'vitest';
import { DIVISION_LABEL, LIFT_LABEL, LIFT_NAME, RISK_CEILING_LABEL, RISK_LABEL, RISK_WORD } from '../../shared/labels';
import { DIVISIONS } from '../../shared/calc';
import { LIFTS } from '../../shared/engine/types';

describe('labels', () => {
  it('name each risk tier with the same word', () => {
    expect(RISK_WORD).toEqual({ 1: 'low', 2: 'moderate', 3: 'high' });
    for (const r of [1, 2, 3] as const) {
      expect(RISK_LABEL[r]).toBe(`${r} · ${RISK_WORD[r]}`);
      expect(RISK_CEILING_LABEL[r].toLowerCase()).toContain(RISK_WORD[r]);
    }
    expect(Object.values({ ...RISK_LABEL, ...RISK_CEILING_LABEL }).join(' ')).not.toMatch(/medium/);
  });

  it('cover every lift and division', () => {
    for (const l of LIFTS) expect(LIFT_NAME[l].startsWith(LIFT_LABEL[l])).toBe(true);
    expect(Object.keys(DIVISION_LABEL).sort()).toEqual([...DIVISIONS].sort());
  });
});
