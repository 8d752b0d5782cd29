export function loadTestEnv(): Record<string, string>;
