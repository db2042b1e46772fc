// Bar loading against the federation's equipment rules, worked examples, and a brute-force optimum.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_BAR_SETUP,
  PLATE_COLOURS,
  isLoadable,
  loadBar,
  loadableBelow,
  plateColour,
  roundToLoadable,
  type PlateSet,
} from '../../../shared/calc';

describe('kilo defaults follow the international federation’s technical rules', () => {
  // Federation technical rules: bar 20 kg, collars 2.5 kg each, discs 25, 20, 15, 10, 5, 2.5, 1.25 kg plus
  // 0.5 kg change discs — secondary/text.
  it('uses a 20 kg bar and 2.5 kg collars', () => {
    expect(DEFAULT_BAR_SETUP.kg.bar).toBe(20);
    expect(DEFAULT_BAR_SETUP.kg.collars).toBe(2.5);
    expect(loadBar(25, { unit: 'kg' })).toEqual({ perSide: [], achieved: 25, remainder: 0 });
  });

  it('has exactly the federation’s discs', () => {
    expect(DEFAULT_BAR_SETUP.kg.plates.map((p) => p.weight)).toEqual([25, 20, 15, 10, 5, 2.5, 1.25, 0.5]);
  });

  it('colours discs 25 red, 20 blue, 15 yellow (rules), 10 green, 5 white, 2.5 black, 1.25 chrome (convention)', () => {
    // The first three are in the rules (secondary/text); the rest are the usual convention (secondary/memory).
    const names = Object.fromEntries(Object.entries(PLATE_COLOURS.kg).map(([w, c]) => [w, c.name]));
    expect(names).toEqual({
      '25': 'red',
      '20': 'blue',
      '15': 'yellow',
      '10': 'green',
      '5': 'white',
      '2.5': 'black',
      '1.25': 'chrome',
      '0.5': 'chrome',
    });
    expect(plateColour(20, 'kg').name).toBe('blue');
    expect(plateColour(7, 'kg').name).toBe('grey');
    expect(Object.keys(PLATE_COLOURS.lb).sort()).toEqual(
      DEFAULT_BAR_SETUP.lb.plates.map((p) => String(p.weight)).sort(),
    );
  });

  it('loads heaviest discs innermost, then in descending order', () => {
    // Federation rules: heaviest discs innermost, lighter ones in descending order — secondary.
    // 217.5 kg: (217.5 − 25)/2 = 96.25 per side = 25 + 25 + 25 + 20 + 1.25.
    expect(loadBar(217.5, { unit: 'kg' })).toEqual({ perSide: [25, 25, 25, 20, 1.25], achieved: 217.5, remainder: 0 });
  });

  it('loads every 2.5 kg step from the empty bar to 600 kg exactly', () => {
    // Attempts go up in multiples of 2.5 kg (federation rules, memory): a platform set must make each one.
    for (let t = 25; t <= 600; t += 2.5) expect(loadBar(t, { unit: 'kg' }).remainder, `${t} kg`).toBe(0);
  });
});

describe('pound defaults (common commercial gym, no single source)', () => {
  it('uses a 45 lb bar and spring clips counted as 0', () => {
    expect(DEFAULT_BAR_SETUP.lb.bar).toBe(45);
    expect(DEFAULT_BAR_SETUP.lb.collars).toBe(0);
    expect(DEFAULT_BAR_SETUP.lb.plates.map((p) => p.weight)).toEqual([45, 35, 25, 10, 5, 2.5]);
  });

  it('loads 315 lb as three 45s a side and every 5 lb step from 45 to 905 lb', () => {
    expect(loadBar(315, { unit: 'lb' }).perSide).toEqual([45, 45, 45]);
    for (let t = 45; t <= 905; t += 5) expect(loadBar(t, { unit: 'lb' }).remainder, `${t} lb`).toBe(0);
  });
});

describe('loadBar worked examples', () => {
  it('comes in under a target the plates cannot hit', () => {
    // 100.5 kg: 37.75 per side. 25 + 10 + 2.5 = 37.5 fits; nothing with one 0.5 pair lands on 37.75.
    expect(loadBar(100.5, { unit: 'kg' })).toEqual({ perSide: [25, 10, 2.5], achieved: 100, remainder: 0.5 });
  });

  it('finds a combination where heaviest-first greedy fails', () => {
    // Per side: one 25 and two 20s, 40 wanted. Greedy takes the 25 and is stuck at 25; 20 + 20 is exact.
    const plates: PlateSet[] = [
      { weight: 25, count: 2 },
      { weight: 20, count: 4 },
    ];
    expect(loadBar(100, { unit: 'kg', bar: 20, collars: 0, plates })).toEqual({
      perSide: [20, 20],
      achieved: 100,
      remainder: 0,
    });
  });

  it('ignores an odd plate that cannot be matched on the other side', () => {
    const plates: PlateSet[] = [{ weight: 20, count: 3 }];
    expect(loadBar(105, { unit: 'kg', plates })).toEqual({ perSide: [20], achieved: 65, remainder: 40 });
  });

  it('prefers fewer plates when two loads tie', () => {
    // 45 per side from 25, 20, 15, 10, 10: 25 + 20 (two plates) rather than 25 + 10 + 10 or 20 + 15 + 10.
    const plates: PlateSet[] = [
      { weight: 25, count: 2 },
      { weight: 20, count: 2 },
      { weight: 15, count: 2 },
      { weight: 10, count: 4 },
    ];
    expect(loadBar(110, { unit: 'kg', bar: 20, collars: 0, plates }).perSide).toEqual([25, 20]);
  });

  it('merges plate entries of the same weight', () => {
    const plates: PlateSet[] = [
      { weight: 20, count: 1 },
      { weight: 20, count: 1 },
    ];
    expect(loadBar(65, { unit: 'kg', plates }).perSide).toEqual([20]);
  });

  it('throws when the target is below the empty bar with collars', () => {
    expect(() => loadBar(20, { unit: 'kg' })).toThrow(RangeError);
    expect(() => loadBar(20, { unit: 'kg' })).toThrow(/20 kg is below the empty bar with collars \(25 kg\)/);
    expect(loadBar(20, { unit: 'kg', collars: 0 })).toEqual({ perSide: [], achieved: 20, remainder: 0 });
  });

  it('rejects bad input with a RangeError naming it', () => {
    expect(() => loadBar(Number.NaN, { unit: 'kg' })).toThrow(/target .*NaN/);
    expect(() => loadBar(-5, { unit: 'kg' })).toThrow(/target .*-5/);
    expect(() => loadBar(100, { unit: 'kg', bar: -1 })).toThrow(/bar .*-1/);
    expect(() => loadBar(100, { unit: 'kg', collars: Number.POSITIVE_INFINITY })).toThrow(/collars .*Infinity/);
    expect(() => loadBar(100, { unit: 'st' as 'kg' })).toThrow(/unit .*"st"/);
    expect(() => loadBar(100, { unit: 'kg', plates: [{ weight: 0, count: 2 }] })).toThrow(/plate weight .*0/);
    expect(() => loadBar(100, { unit: 'kg', plates: [{ weight: 10, count: 1.5 }] })).toThrow(
      /count of 10 kg plates .*1\.5/,
    );
  });
});

describe('roundToLoadable, loadableBelow, isLoadable', () => {
  it('rounds to the nearest loadable total, ties going down', () => {
    expect(roundToLoadable(101.2, 'kg')).toBe(101); // 101 (25+10+2.5+0.5 a side) is 0.2 away, 102.5 is 1.3
    // Near 100 kg the kilo set makes 98.5 and 100 (36.75 and 37.5 a side) and nothing between: 99.25 is a tie.
    expect(roundToLoadable(99.25, 'kg')).toBe(98.5);
    expect(roundToLoadable(229, 'lb')).toBe(230);
    expect(roundToLoadable(227.5, 'lb')).toBe(225);
  });

  it('rounds down or up on request', () => {
    expect(roundToLoadable(229, 'lb', { mode: 'down' })).toBe(225);
    expect(roundToLoadable(226, 'lb', { mode: 'up' })).toBe(230);
    expect(roundToLoadable(230, 'lb', { mode: 'up' })).toBe(230);
  });

  it('gives the empty bar below it, and the heaviest load above what the plates make', () => {
    expect(roundToLoadable(10, 'kg')).toBe(25);
    expect(roundToLoadable(10, 'kg', { mode: 'up' })).toBe(25);
    expect(() => roundToLoadable(10, 'kg', { mode: 'down' })).toThrow(RangeError);
    // 25 + 2·(10·25 + 20 + 15 + 10 + 5 + 2.5 + 1.25 + 0.5) = 25 + 2·304.25 = 633.5
    expect(roundToLoadable(5000, 'kg')).toBe(633.5);
    expect(() => roundToLoadable(5000, 'kg', { mode: 'up' })).toThrow(/more than these plates can load/);
  });

  it('finds the heaviest load strictly below a weight', () => {
    // Under 37.5 a side, the closest the kilo set makes is 25 + 10 + 1.25 + 0.5 = 36.75 → 98.5 kg.
    expect(loadableBelow(100, 'kg')).toBe(98.5);
    expect(loadableBelow(25, 'kg')).toBeUndefined();
    expect(loadableBelow(50, 'lb')).toBe(45);
  });

  it('says whether a weight can be loaded exactly', () => {
    expect(isLoadable(102.5, 'kg')).toBe(true);
    expect(isLoadable(101, 'kg')).toBe(true); // 38 a side = 25 + 10 + 2.5 + 0.5
    expect(isLoadable(100.5, 'kg')).toBe(false);
    expect(isLoadable(20, 'kg')).toBe(false);
    expect(isLoadable(137.5, 'lb')).toBe(false);
  });
});

// Brute force over every way to put the given pairs on one side: the reference for optimality.
function bruteForce(target: number, base: number, plates: PlateSet[]): { achieved: number; plates: number } {
  const kinds = plates.map((p) => ({ w: p.weight, n: Math.floor(p.count / 2) }));
  let best = { achieved: base, plates: 0 };
  const walk = (i: number, side: number, used: number): void => {
    if (i === kinds.length) {
      const total = base + 2 * side;
      if (
        total <= target + 1e-9 &&
        (total > best.achieved + 1e-9 || (Math.abs(total - best.achieved) < 1e-9 && used < best.plates))
      ) {
        best = { achieved: total, plates: used };
      }
      return;
    }
    const { w, n } = kinds[i]!;
    for (let k = 0; k <= n; k++) walk(i + 1, side + k * w, used + k);
  };
  walk(0, 0, 0);
  return best;
}

describe('loadBar properties', () => {
  const plateSet = fc
    .uniqueArray(fc.constantFrom(25, 20, 15, 10, 5, 2.5, 1.25, 0.5), { minLength: 1, maxLength: 5 })
    .chain((ws) => fc.tuple(...ws.map((w) => fc.integer({ min: 0, max: 7 }).map((count) => ({ weight: w, count })))));
  const bar = fc.constantFrom(15, 20, 25);
  const collars = fc.constantFrom(0, 2.5);

  it('matches a brute-force search: the heaviest total not over the target, with the fewest plates', () => {
    fc.assert(
      fc.property(plateSet, bar, collars, fc.integer({ min: 0, max: 4000 }), (plates, b, c, extra) => {
        const base = b + 2 * c;
        const target = base + extra / 20; // a 0.05 grid, up to 200 above the empty bar
        const got = loadBar(target, { unit: 'kg', bar: b, collars: c, plates });
        const want = bruteForce(target, base, plates);
        expect(got.achieved).toBeCloseTo(want.achieved, 9);
        expect(got.perSide).toHaveLength(want.plates);
      }),
    );
  });

  it('never exceeds the target, is symmetric, heaviest first, and uses only the plates there are', () => {
    fc.assert(
      fc.property(plateSet, bar, collars, fc.double({ min: 0, max: 400, noNaN: true }), (plates, b, c, over) => {
        const base = b + 2 * c;
        const target = base + over;
        const got = loadBar(target, { unit: 'kg', bar: b, collars: c, plates });
        expect(got.achieved).toBeLessThanOrEqual(target);
        expect(got.remainder).toBeGreaterThanOrEqual(0);
        expect(got.achieved + got.remainder).toBeCloseTo(target, 5);
        // Both sides carry perSide, so the total is the base plus twice one side.
        expect(got.achieved).toBeCloseTo(base + 2 * got.perSide.reduce((s, w) => s + w, 0), 9);
        expect([...got.perSide].sort((x, y) => y - x)).toEqual(got.perSide);
        for (const w of new Set(got.perSide)) {
          const available = plates.filter((p) => p.weight === w).reduce((s, p) => s + p.count, 0);
          expect(2 * got.perSide.filter((x) => x === w).length).toBeLessThanOrEqual(available);
        }
      }),
    );
  });

  it('rounds to a loadable total that no other loadable total beats', () => {
    fc.assert(
      fc.property(fc.double({ min: 25, max: 400, noNaN: true }), (w) => {
        const r = roundToLoadable(w, 'kg');
        expect(isLoadable(r, 'kg')).toBe(true);
        const down = loadBar(w, { unit: 'kg' }).achieved;
        const up = roundToLoadable(w, 'kg', { mode: 'up' });
        expect(Math.abs(r - w)).toBeLessThanOrEqual(Math.min(w - down, up - w) + 1e-9);
      }),
    );
  });
});
