// The add-in's icons, drawn from code: a falling stiffness curve (high plateau, drop, low plateau) on a rounded
// square, with axes at the larger sizes. Original design for Resin Derate.
//
//   node scripts/icons.mjs [outDir]     writes icon-16.png ... icon-128.png (default manifest/icons)
//
// Rendering uses only + - * / and sqrt on doubles, so the pixels are the same on every machine. The PNG bytes may
// still differ between zlib builds, which is why the test compares decoded pixels, not file bytes.
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { deflateSync, inflateSync } from 'node:zlib';

export const ICON_SIZES = [16, 32, 64, 80, 128];

const TRANSPARENT = [0, 0, 0, 0];
const TILE = [23, 80, 107, 255];
const CURVE = [245, 176, 65, 255];
const AXIS = [207, 227, 236, 255];
const SUBSAMPLES = 4;

function smoothstep(t) {
  const c = t < 0 ? 0 : t > 1 ? 1 : t;
  return c * c * (3 - 2 * c);
}

/** Points of the falling curve in unit coordinates (y grows downwards, as in the image). */
function curvePoints() {
  const points = [];
  const n = 64;
  for (let i = 0; i <= n; i++) {
    const x = 0.17 + (0.66 * i) / n;
    const y = 0.3 + 0.42 * smoothstep((x - 0.36) / 0.3);
    points.push([x, y]);
  }
  return points;
}

function distanceToSegment(px, py, ax, ay, bx, by) {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  let t = len2 === 0 ? 0 : ((px - ax) * dx + (py - ay) * dy) / len2;
  t = t < 0 ? 0 : t > 1 ? 1 : t;
  const qx = ax + t * dx - px;
  const qy = ay + t * dy - py;
  return Math.sqrt(qx * qx + qy * qy);
}

function insideRoundedSquare(x, y, radius) {
  const cx = x < radius ? radius : x > 1 - radius ? 1 - radius : x;
  const cy = y < radius ? radius : y > 1 - radius ? 1 - radius : y;
  const dx = x - cx;
  const dy = y - cy;
  return dx * dx + dy * dy <= radius * radius;
}

/** Renders one square icon; returns 8-bit RGBA rows, top to bottom. */
export function renderIcon(size) {
  const curve = curvePoints();
  // Strokes stay at least about 1.3 px wide so the 16 px icon still reads.
  const curveHalf = Math.max(0.055, 0.65 / size);
  const axisHalf = Math.max(0.02, 0.5 / size);
  const withAxes = size >= 32;
  const rgba = new Uint8Array(size * size * 4);
  for (let py = 0; py < size; py++) {
    for (let px = 0; px < size; px++) {
      const sum = [0, 0, 0, 0];
      for (let sy = 0; sy < SUBSAMPLES; sy++) {
        for (let sx = 0; sx < SUBSAMPLES; sx++) {
          const x = (px + (sx + 0.5) / SUBSAMPLES) / size;
          const y = (py + (sy + 0.5) / SUBSAMPLES) / size;
          let colour = TRANSPARENT;
          if (insideRoundedSquare(x, y, 0.2)) {
            colour = TILE;
            if (
              withAxes &&
              ((Math.abs(x - 0.13) <= axisHalf && y >= 0.16 && y <= 0.84) || (Math.abs(y - 0.84) <= axisHalf && x >= 0.13 && x <= 0.87))
            ) {
              colour = AXIS;
            }
            for (let i = 1; i < curve.length; i++) {
              const a = curve[i - 1];
              const b = curve[i];
              if (distanceToSegment(x, y, a[0], a[1], b[0], b[1]) <= curveHalf) {
                colour = CURVE;
                break;
              }
            }
          }
          // Premultiplied sums, so transparent samples do not darken the edge.
          for (let c = 0; c < 3; c++) sum[c] += colour[c] * colour[3];
          sum[3] += colour[3];
        }
      }
      const o = (py * size + px) * 4;
      const n = SUBSAMPLES * SUBSAMPLES;
      const alphaSum = sum[3];
      for (let c = 0; c < 3; c++) rgba[o + c] = alphaSum === 0 ? 0 : Math.round(sum[c] / alphaSum);
      rgba[o + 3] = Math.round(alphaSum / n);
    }
  }
  return { width: size, height: size, rgba };
}

const CRC_TABLE = (() => {
  const table = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    table[n] = c >>> 0;
  }
  return table;
})();

/** CRC-32 as PNG defines it (ISO 3309 / ITU-T V.42 polynomial). */
export function crc32(bytes) {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

const SIGNATURE = Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]);

function chunk(type, data) {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, 'latin1');
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])), 0);
  return Buffer.concat([head, data, crc]);
}

/** Encodes 8-bit RGBA as a PNG (colour type 6, no interlace, filter type 0 on every row). */
export function encodePng({ width, height, rgba }) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8;
  ihdr[9] = 6;
  const stride = width * 4;
  const raw = Buffer.alloc((stride + 1) * height);
  for (let y = 0; y < height; y++) {
    raw[y * (stride + 1)] = 0;
    Buffer.from(rgba.buffer, rgba.byteOffset + y * stride, stride).copy(raw, y * (stride + 1) + 1);
  }
  return Buffer.concat([SIGNATURE, chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw, { level: 9 })), chunk('IEND', Buffer.alloc(0))]);
}

/** Reads width and height from a PNG header without decoding it. Throws if the bytes are not a PNG. */
export function pngSize(bytes) {
  if (bytes.length < 24 || !SIGNATURE.equals(bytes.subarray(0, 8)) || bytes.toString('latin1', 12, 16) !== 'IHDR') {
    throw new Error('not a PNG file (bad signature or missing IHDR)');
  }
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

/** Decodes the PNGs this module writes (8-bit RGBA, filter type 0); checks every chunk's CRC. */
export function decodePng(bytes) {
  const { width, height } = pngSize(bytes);
  const idat = [];
  let offset = 8;
  let ended = false;
  while (offset < bytes.length) {
    const length = bytes.readUInt32BE(offset);
    const type = bytes.toString('latin1', offset + 4, offset + 8);
    const body = bytes.subarray(offset + 8, offset + 8 + length);
    const crc = bytes.readUInt32BE(offset + 8 + length);
    if (crc32(bytes.subarray(offset + 4, offset + 8 + length)) !== crc) throw new Error(`PNG chunk ${type} has a bad CRC`);
    if (type === 'IHDR' && (body[8] !== 8 || body[9] !== 6 || body[12] !== 0))
      throw new Error('only 8-bit RGBA, non-interlaced PNGs are read here');
    if (type === 'IDAT') idat.push(body);
    if (type === 'IEND') ended = true;
    offset += 12 + length;
  }
  if (!ended) throw new Error('PNG has no IEND chunk');
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * 4;
  if (raw.length !== (stride + 1) * height) throw new Error('PNG image data has the wrong length');
  const rgba = new Uint8Array(stride * height);
  for (let y = 0; y < height; y++) {
    if (raw[y * (stride + 1)] !== 0) throw new Error(`PNG row ${y} uses filter type ${raw[y * (stride + 1)]}; only type 0 is read here`);
    rgba.set(raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1)), y * stride);
  }
  return { width, height, rgba };
}

/** Writes every icon size into outDir; returns the written paths. */
export function writeIcons(outDir) {
  mkdirSync(outDir, { recursive: true });
  return ICON_SIZES.map((size) => {
    const path = join(outDir, `icon-${size}.png`);
    writeFileSync(path, encodePng(renderIcon(size)));
    return path;
  });
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const outDir = process.argv[2] ?? fileURLToPath(new URL('../manifest/icons/', import.meta.url));
  for (const path of writeIcons(outDir)) console.log(`wrote ${path}`);
}
