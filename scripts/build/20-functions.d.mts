/** Types of the functions build step, for the tests that call its metadata generation. */
export const BUDGET: { minifiedKB: number; gzipKB: number };

export interface MetadataParameter {
  name: string;
  description?: string;
  type?: string;
  dimensionality?: 'matrix';
  optional?: boolean;
}
export interface MetadataFunction {
  id: string;
  name: string;
  description?: string;
  parameters: MetadataParameter[];
  result?: { type?: string; dimensionality?: 'matrix' };
}
export interface Associate {
  sourceFileName: string;
  functionName: string;
  id: string;
}

export function functionsMetadata(files?: string[]): Promise<{ metadata: { functions: MetadataFunction[] }; associate: Associate[] }>;
export default function buildFunctions(): Promise<void>;
