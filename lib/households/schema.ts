import { z } from 'zod';
import { NewPassword } from '@/lib/account/schema';
import { ROLES } from '@/lib/roles';
import { name } from '@/lib/validation/fields';

export const HouseholdInput = z.object({
  name: name({ min: 1, max: 120, label: 'The household name' }),
});
export type HouseholdInput = z.infer<typeof HouseholdInput>;

const roleEnum = z.enum(ROLES, { message: 'Choose coordinator, sugarmaker or member.' });

export const PersonInput = z
  .object({
    name: name({ min: 1, max: 120, label: 'The name' }),
    email: z.string().trim().toLowerCase().email('Enter an e-mail address like name@example.org.'),
    role: roleEnum,
    householdId: z.string().uuid('Choose a household.').nullish(),
  })
  .refine((p) => p.role !== 'member' || !!p.householdId, {
    path: ['householdId'],
    message: 'A member belongs to a household: choose one.',
  });
export type PersonInput = z.infer<typeof PersonInput>;

export const RoleChange = z
  .object({
    role: roleEnum,
    householdId: z.string().uuid('Choose a household.').nullish(),
  });
export type RoleChange = z.infer<typeof RoleChange>;

export const AcceptInvitation = z.object({
  token: z.string().min(20, 'This invitation link is incomplete.'),
  password: NewPassword,
});
