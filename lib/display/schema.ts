import { z } from 'zod';

export const DisplayLinkInput = z.object({
  name: z.string().trim().min(1, 'Name the screen, e.g. “Sugarhouse TV”.').max(80, 'Keep the name under 80 characters.'),
});
export type DisplayLinkInput = z.infer<typeof DisplayLinkInput>;
