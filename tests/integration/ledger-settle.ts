import { expect } from 'vitest';
import { signedIn, type Client } from './http';
import { rows } from './db';
import { makeWorkedExample, type WorkedExample } from './ledger-fixture';

/** The worked example, its runs finished through the Runs API and the season closed. */
export async function closedWorkedExample(): Promise<{ ex: WorkedExample; coordinator: Client; sugarmaker: Client }> {
  const ex = await makeWorkedExample();
  const coordinator = await signedIn(ex.emails.coordinator);
  const sugarmaker = await signedIn(ex.emails.sugarmaker);
  for (const run of [ex.runs.run1, ex.runs.run2]) expect((await sugarmaker.post(`/api/runs/${run}/finish`, {})).status).toBe(200);
  expect((await coordinator.post(`/api/seasons/${ex.seasonId}/close`)).status).toBe(200);
  return { ex, coordinator, sugarmaker };
}

export async function statementIds(ex: WorkedExample): Promise<Record<'ash' | 'birch' | 'cedar', string>> {
  const list = await rows<{ id: string; household_id: string }>(`SELECT id, household_id FROM settlements WHERE season_id = :s`, { s: ex.seasonId });
  const by = (h: string) => list.find((r) => r.household_id === h)!.id;
  return { ash: by(ex.households.ash), birch: by(ex.households.birch), cedar: by(ex.households.cedar) };
}
