/** The co-op's seasons and evaporators as the API answers them (client-safe). */

export interface SeasonDto {
  id: string;
  label: string;
  startsOn: string;
  endsOn: string;
  status: string;
  fuelPriceCents: number;
}

export interface EvaporatorDto {
  id: string;
  name: string;
  evaporationLph: number;
  fuelKind: string;
}
