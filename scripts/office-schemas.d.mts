/** Types for scripts/office-schemas.mjs (used by the build and test/schemas.test.ts). */
export declare const SCHEMA_DIR: string;
export declare const MANIFEST_XSD: string;
export declare const METADATA_SCHEMA: string;
export declare const METADATA_LIMITS: {
  readonly idMin: number;
  readonly idMax: number;
  readonly nameMin: number;
  readonly nameMax: number;
  readonly description: number;
  readonly parameterDescription: number;
  readonly fileBytes: number;
};
export declare const METADATA_ALLOWED: {
  readonly topLevel: readonly string[];
  readonly function: readonly string[];
  readonly options: readonly string[];
  readonly parameter: readonly string[];
  readonly result: readonly string[];
};
export declare function hasXmllint(): boolean;
export declare function manifestXsdProblems(text: string, name?: string): string[];
export declare function metadataProblems(metadata: unknown): string[];
export declare function withoutGeneratorDefaults<T extends object>(metadata: T): Omit<T, 'allowCustomDataForDataTypeAny'>;
