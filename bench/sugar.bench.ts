import { bench, describe } from 'vitest';
import { allocateRun, sugarKg, type RunInputSugar } from '@/lib/sugar';

// Deterministic pseudo-random data (mulberry32) so runs compare like with like.
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const SURNAMES = ['Okafor', 'Lindqvist', 'Tremblay-Haddad', 'Nakamura', 'Brennan', 'Szabo', 'Ferreira'];

const rnd = random(2025);
const runInputs: RunInputSugar[] = Array.from({ length: 200 }, (_, i) => ({
  household: `${SURNAMES[i % SURNAMES.length]} ${Math.floor(i / SURNAMES.length) + 1}`,
  sugarKg: sugarKg(50 + rnd() * 950, 1.4 + rnd() * 1.8),
}));

const season = Array.from({ length: 20_000 }, () => ({ volumeL: 20 + rnd() * 480, brix: 1.4 + rnd() * 1.8 }));

describe('sugar', () => {
  bench('allocateRun, 200 households', () => {
    allocateRun(runInputs, { syrupMl: 1_234_567, fuelCents: 987_654 });
  });

  bench('sugarKg × 20,000 (a season of drop-offs)', () => {
    let total = 0;
    for (const lot of season) total += sugarKg(lot.volumeL, lot.brix);
    if (!(total > 0)) throw new Error('no sugar');
  });
});
