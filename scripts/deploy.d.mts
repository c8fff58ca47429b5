/** Types for scripts/deploy.mjs (used by the tests). */
export declare const USAGE: string;
export declare const CHUNK_DIRS: readonly string[];
export interface DeployOptions {
  base: string | undefined;
  out: string;
  build: boolean;
  help: boolean;
}
export declare function parseDeployArgs(argv: readonly string[]): DeployOptions;
export declare function scriptReferences(js: string): string[];
export declare function missingReferences(out: string): string[];
export interface DeployResult {
  out: string;
  base: string;
  version: string;
  written: string[];
  kept: string[];
  urls: string[];
}
export declare function deploy(options: { base: string; out: string; dist?: string }): DeployResult;
