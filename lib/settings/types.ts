/** The co-op's settings as the API answers them (client-safe). */
import type { SettingsInput } from './schema';

export type SettingsDto = SettingsInput;
