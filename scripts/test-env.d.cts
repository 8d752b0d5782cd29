/** The test set-up's environment (scripts/test-env.sh), put into this process and returned. */
export declare function loadTestEnv(): Record<string, string>;
