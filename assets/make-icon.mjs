// Draws Phasewright's mark (a slate-blue diamond in a rounded square on drafting paper) into a PNG, with zlib
// only: `node assets/make-icon.mjs [size] [out]`. Kept so the icon can be remade at any size.
import { writeFileSync } from 'node:fs';
import { deflateSync } from 'node:zlib';

const size = Number(process.argv[2] ?? 96);
const out = process.argv[3] ?? new URL('./images/favicon.png', import.meta.url);

const paper = [244, 239, 227, 255];
const ink = [31, 86, 115, 255];
const clear = [0, 0, 0, 0];

// Signed-distance shapes in unit coordinates (-1..1), sampled 4x4 per pixel for smooth edges.
function roundedSquare(x, y, half, r) {
  const qx = Math.abs(x) - half + r;
  const qy = Math.abs(y) - half + r;
  return Math.hypot(Math.max(qx, 0), Math.max(qy, 0)) + Math.min(Math.max(qx, qy), 0) - r;
}
const diamond = (x, y, half) => (Math.abs(x) + Math.abs(y) - half) / Math.SQRT2;

function colourAt(x, y) {
  const outer = roundedSquare(x, y, 0.96, 0.26);
  if (outer > 0) return clear;
  const frame = roundedSquare(x, y, 0.8, 0.16);
  if (frame <= 0 && frame > -0.11) return ink; // the frame's line
  if (diamond(x, y, 0.42) <= 0) return ink; // the diamond
  return paper;
}

const samples = 4;
const raw = Buffer.alloc(size * (size * 4 + 1));
for (let py = 0; py < size; py++) {
  raw[py * (size * 4 + 1)] = 0; // filter: none
  for (let px = 0; px < size; px++) {
    const acc = [0, 0, 0, 0];
    for (let sy = 0; sy < samples; sy++) {
      for (let sx = 0; sx < samples; sx++) {
        const x = ((px + (sx + 0.5) / samples) / size) * 2 - 1;
        const y = ((py + (sy + 0.5) / samples) / size) * 2 - 1;
        const c = colourAt(x, y);
        const a = c[3] / 255;
        acc[0] += c[0] * a;
        acc[1] += c[1] * a;
        acc[2] += c[2] * a;
        acc[3] += c[3];
      }
    }
    const n = samples * samples;
    const alpha = acc[3] / n;
    const o = py * (size * 4 + 1) + 1 + px * 4;
    const cover = alpha / 255 || 1;
    raw[o] = Math.round(acc[0] / n / cover);
    raw[o + 1] = Math.round(acc[1] / n / cover);
    raw[o + 2] = Math.round(acc[2] / n / cover);
    raw[o + 3] = Math.round(alpha);
  }
}

const crcTable = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(buf) {
  let c = 0xffffffff;
  for (const b of buf) c = crcTable[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
function chunk(type, data) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

const header = Buffer.alloc(13);
header.writeUInt32BE(size, 0);
header.writeUInt32BE(size, 4);
header[8] = 8; // bit depth
header[9] = 6; // RGBA
const png = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
  chunk('IHDR', header),
  chunk('IDAT', deflateSync(raw)),
  chunk('IEND', Buffer.alloc(0)),
]);
writeFileSync(out, png);
console.log(`wrote ${size}x${size} PNG (${png.length} bytes)`);
