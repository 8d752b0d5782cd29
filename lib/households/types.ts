/** Households and people as the API answers them (client-safe). */
import type { Role } from '@/lib/roles';

export interface PersonDto {
  id: string;
  name: string;
  email: string;
  role: Role;
  householdId: string | null;
  invited: boolean;
}

export interface HouseholdDto {
  id: string;
  name: string;
  people: PersonDto[];
}
