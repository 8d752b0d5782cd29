import type { GradeClass } from '@/lib/sugar';

/** A boil run as the API answers it (SI; money in integer cents). */
export interface RunDto {
  id: string;
  seasonId: string;
  runNumber: number;
  lotCode: string;
  evaporatorId: string;
  evaporatorName: string;
  slotId: string | null;
  status: 'running' | 'finished';
  startedAt: string;
  finishedAt: string | null;
  startedByName: string | null;
  finishedByName: string | null;
  note: string | null;
  inputs: { id: string; deliveryId: string; householdId: string; householdName: string; litres: number; brix: number; sugarKg: number; takenAt: string }[];
  draws: { id: string; drawnAt: string; litres: number; brix: number; transmittancePct: number | null; gradeClass: GradeClass; temperatureC: number | null }[];
  fuel: { id: string; kind: string; quantity: number; unit: 'cord' | 'litre'; costCents: number; recordedAt: string }[];
  totals: { inputL: number; sugarKg: number; syrupExpectedL: number; syrupDrawnL: number; fuelCostCents: number };
}
