/** Types for scripts/icons.mjs (used by the tests). */
export interface RgbaImage {
  readonly width: number;
  readonly height: number;
  readonly rgba: Uint8Array;
}
export declare const ICON_SIZES: readonly number[];
export declare function renderIcon(size: number): RgbaImage;
export declare function crc32(bytes: Uint8Array): number;
export declare function encodePng(image: RgbaImage): Buffer;
export declare function pngSize(bytes: Buffer): { width: number; height: number };
export declare function decodePng(bytes: Buffer): RgbaImage;
export declare function writeIcons(outDir: string): string[];
