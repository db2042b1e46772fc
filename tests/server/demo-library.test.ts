// The demo library's tags, checked as a coach would read them. The basis of each is common coaching
// practice with no published source (see the library's opening comment); the values are our own.
import { describe, expect, it } from 'vitest';
import { DEMO_LIBRARY } from '../../server/db/seed/demo-library';

const byName = (name: string) => DEMO_LIBRARY.find((v) => v.name === name)!;
const UPPER = ['shoulder', 'elbow', 'wrist'] as const;

describe('demo library tags', () => {
  it('loads shoulders, elbows and wrists more in straight-bar back squats than with the special bars', () => {
    const backSquats = DEMO_LIBRARY.filter(
      (v) => v.lift === 'squat' && v.family !== 'front squat' && v.family !== 'belt squat',
    );
    const straight = backSquats.filter((v) => v.bar === 'straight');
    const special = backSquats.filter((v) => v.bar === 'safety squat' || v.bar === 'cambered');
    expect(straight.length).toBeGreaterThan(5);
    expect(special.length).toBeGreaterThan(3);
    for (const v of straight)
      for (const j of UPPER) expect(v.stress[j] ?? 0, `${v.name} ${j}`).toBeGreaterThanOrEqual(1);
    for (const v of special) for (const j of UPPER) expect(v.stress[j] ?? 0, `${v.name} ${j}`).toBe(0);
    // Same movement, two bars: the special bar gets credit for sparing the upper body.
    const sum = (name: string) => UPPER.reduce((n, j) => n + (byName(name).stress[j] ?? 0), 0);
    expect(sum('Box squat, parallel box')).toBeGreaterThan(sum('Box squat, parallel box, safety squat bar'));
    expect(sum('Pause squat, 3-second pause')).toBeGreaterThan(sum('Pause squat, safety squat bar'));
  });

  it('does not call heavy pulls above the knee low-risk, and counts the mixed grip on the elbow', () => {
    for (const name of ['Rack pull, above knee', 'Rack pull, at knee', 'Block pull, 10 cm']) {
      expect(byName(name).risk, name).toBeGreaterThanOrEqual(2);
    }
    const heavyPulls = DEMO_LIBRARY.filter((v) =>
      ['rack pull', 'block pull', 'competition pull', 'accommodated pull'].includes(v.family),
    );
    expect(heavyPulls.length).toBeGreaterThan(6);
    for (const v of heavyPulls) expect(v.stress.elbow ?? 0, v.name).toBeGreaterThanOrEqual(1);
  });

  it('tags reverse-band bench as lockout work', () => {
    expect(byName('Reverse-band bench press').emphasis).toBe('lockout');
  });

  it('keeps opener singles, and only them, to the last three weeks before a meet', () => {
    const phased = DEMO_LIBRARY.filter((v) => v.meetPhaseWeeks !== undefined);
    expect(phased.map((v) => v.name).sort()).toEqual([
      'Competition bench press, opener single',
      'Competition deadlift, opener single',
      'Competition squat, opener single',
    ]);
    for (const v of phased) expect(v.meetPhaseWeeks).toBe(3);
  });
});
