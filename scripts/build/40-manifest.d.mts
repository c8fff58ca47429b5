/** Types of the manifest build step, for test/schemas.test.ts. */
import type { ManifestSummary } from '../manifest-check.mjs';

export const DEV_ORIGIN: string;
export function manifestProblems(
  text: string,
  version: string,
): { problems: string[]; summary: ManifestSummary | undefined; xsdChecked: boolean };
export default function buildManifest(): Promise<void>;
