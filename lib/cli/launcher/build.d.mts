/** Types of build.mjs (plain JavaScript so that it runs before anything is compiled). */
export declare const ROOT: string;
export declare const OUT_DIR: string;
export declare const OUT_FILE: string;
export declare const BUILD_FILE: string;
export declare function cacheFileOf(buildId: string): string;
export declare function writeAtomic(path: string, data: string | Uint8Array): void;
export declare function buildCli(): Promise<{ id: string; bytes: number; inputs: number }>;
export declare function linkBin(): void;
