import { seedCoop, type CoopSpec, type GeneratedCoop } from '@/db/seeds/scale';
import { testDb } from './db';

// Test-only co-ops beside the demo one (never in the demo data): generated small, with their own
// people (coordinator@, sugarmaker@, member-00001@ … at their domain; the demo password).

/** Another co-op on the same deployment: nothing of it may show to Larkspur's people, or back. */
export const OTHER_COOP: CoopSpec = {
  name: 'Quillfeather Glen Cooperative',
  domain: 'quillfeather.example',
  households: 3,
  lots: 30,
  runs: 3,
  waiting: 6,
  evaporators: 1,
  timeZone: 'America/Halifax',
  unitSystem: 'metric',
  currency: 'CAD',
};

/** A co-op for the fuzz test, whose coordinator's accidental valid writes touch nobody else's data. */
export const FUZZ_COOP: CoopSpec = {
  name: 'Fuzzwood Test Cooperative',
  domain: 'fuzzwood.example',
  households: 3,
  lots: 30,
  runs: 3,
  waiting: 6,
  evaporators: 1,
};

/** Generates the co-op afresh (dropping an earlier copy). */
export function generateCoop(spec: CoopSpec): Promise<GeneratedCoop> {
  return seedCoop(testDb(), spec);
}
