/** Types of build.mjs (plain JavaScript so that it runs before anything is compiled). */
export declare const ROOT: string;
export declare const OUT_DIR: string;
export declare const OUT_FILE: string;
export declare const INPUTS_FILE: string;
export declare function buildCli(): Promise<{ bytes: number; inputs: number }>;
