/** The planning strip's response type (client-safe). */
import type { BoilPlan } from './rules';

export interface PlanningDto extends BoilPlan {
  evaporatorId: string | null;
  evaporationLph: number | null;
}
