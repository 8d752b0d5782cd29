/** The three roles a person can hold in a cooperative, most powerful first. */
export const ROLES = ['coordinator', 'sugarmaker', 'member'] as const;
export type Role = (typeof ROLES)[number];
