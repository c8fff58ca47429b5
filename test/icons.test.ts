import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { crc32, decodePng, encodePng, ICON_SIZES, pngSize, renderIcon } from '../scripts/icons.mjs';

const tmp = mkdtempSync(join(tmpdir(), 'resin-icons-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

describe('PNG encoder', () => {
  it('computes the CRC-32 check value 0xCBF43926 of "123456789"', () => {
    // Check value of CRC-32/ISO-HDLC, the CRC that PNG uses (ISO/IEC 15948 annex D; the CRC catalogue's check value).
    expect(crc32(Buffer.from('123456789', 'latin1'))).toBe(0xcbf43926);
  });
  it('round-trips pixels through encode and decode', () => {
    const rgba = new Uint8Array(3 * 2 * 4).map((_, i) => (i * 37) % 256);
    const back = decodePng(encodePng({ width: 3, height: 2, rgba }));
    expect([back.width, back.height]).toEqual([3, 2]);
    expect(Buffer.from(back.rgba).equals(Buffer.from(rgba))).toBe(true);
  });
  it('rejects a file whose image data was damaged', () => {
    const png = encodePng(renderIcon(16));
    const bad = Buffer.from(png);
    bad[45] = (bad[45] ?? 0) ^ 0xff; // inside the IDAT chunk
    expect(() => decodePng(bad)).toThrow(/CRC/);
    expect(() => pngSize(Buffer.from('GIF89a, not a png at all'))).toThrow(/not a PNG/);
  });
});

describe('committed icons', () => {
  for (const size of ICON_SIZES) {
    it(`manifest/icons/icon-${size}.png is ${size} x ${size} and matches the generator pixel for pixel`, () => {
      const committed = decodePng(readFileSync(`manifest/icons/icon-${size}.png`));
      const fresh = renderIcon(size);
      expect([committed.width, committed.height]).toEqual([size, size]);
      expect(Buffer.from(committed.rgba).equals(Buffer.from(fresh.rgba)), 'run `node scripts/icons.mjs` to regenerate').toBe(true);
    });
  }

  it('the generator CLI writes the same pixels into another folder', () => {
    const run = spawnSync(process.execPath, ['scripts/icons.mjs', tmp], { encoding: 'utf8' });
    expect(run.status, run.stderr).toBe(0);
    for (const size of ICON_SIZES) {
      const written = decodePng(readFileSync(join(tmp, `icon-${size}.png`)));
      expect(Buffer.from(written.rgba).equals(Buffer.from(renderIcon(size).rgba))).toBe(true);
    }
  });

  it('draws the glyph: transparent corners, the tile colour and the curve colour', () => {
    const { rgba, width } = renderIcon(128);
    const px = (x: number, y: number) => Array.from(rgba.subarray((y * width + x) * 4, (y * width + x) * 4 + 4));
    expect(px(0, 0)[3]).toBe(0);
    expect(px(127, 127)[3]).toBe(0);
    expect(px(100, 20)).toEqual([23, 80, 107, 255]); // tile, above the low plateau
    expect(px(32, 38)).toEqual([245, 176, 65, 255]); // on the high plateau of the curve (y = 0.30)
    expect(px(100, 92)).toEqual([245, 176, 65, 255]); // on the low plateau (y = 0.72)
    const colours = new Set<string>();
    for (let i = 0; i < rgba.length; i += 4) colours.add(Array.from(rgba.subarray(i, i + 4)).join(','));
    expect(colours.size).toBeGreaterThan(10);
  });
});
