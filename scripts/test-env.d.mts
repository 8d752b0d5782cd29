export function useTestEnv(): Record<string, string>;
