// Seeded randomness for tie-breaks and reshuffles: one stream per athlete, so athletes stay independent.

import alea from 'seedrandom/lib/alea.js';

export function athleteRng(seed: string, athleteId: string): () => number {
  const prng = alea(`${seed}:${athleteId}`);
  return () => prng();
}
