/** Types for scripts/manifest-check.mjs (used by the tests and the build). */
export declare const NS: { readonly app: string; readonly ov: string; readonly bt: string; readonly xsi: string };
export declare const LIMITS: { readonly short: number; readonly long: number; readonly resid: number; readonly url: number };
export declare const ICON_SIZES_REQUIRED: readonly number[];
export declare const ICON_SIZES_ALLOWED: readonly number[];
export declare const APP_ICON_SIZES: { readonly IconUrl: number; readonly HighResolutionIconUrl: number };
export declare const MAX_IMAGE_BYTES: number;

export interface XmlNode {
  ns: string;
  name: string;
  attrs: Record<string, string>;
  children: XmlNode[];
  text: string;
  line: number;
}
export declare function parseXml(text: string): XmlNode;

export interface CheckOptions {
  iconDir?: string;
  namespace?: string;
  permission?: string;
  version?: string;
  contract?: { page?: string; script?: string; metadata?: string };
}
export interface ManifestSummary {
  id: string | undefined;
  version: string | undefined;
  origin: string | undefined;
  namespace: string | undefined;
  permission: string | undefined;
  urls: string[];
}
export declare function checkManifest(text: string, options?: CheckOptions): { problems: string[]; summary: ManifestSummary | undefined };
export declare function addinBase(text: string): string;
export declare function rebaseManifest(text: string, fromOrigin: string, toBase: string): string;
