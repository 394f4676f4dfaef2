// Draws resources/icon.png (512x512): a ring of event dots around a fixation point, in the
// console's own colours. electron-builder derives the Windows and macOS icons from it.
import { writeFileSync } from 'node:fs';
import { deflateSync } from 'node:zlib';

const size = 512;
const rgba = new Uint8Array(size * size * 4);
const put = (x, y, [r, g, b], a = 255) => {
  if (x < 0 || y < 0 || x >= size || y >= size) return;
  const i = (y * size + x) * 4;
  rgba.set([r, g, b, a], i);
};
const disc = (cx, cy, radius, colour) => {
  for (let y = Math.floor(cy - radius); y <= cy + radius; y++)
    for (let x = Math.floor(cx - radius); x <= cx + radius; x++) if ((x - cx) ** 2 + (y - cy) ** 2 <= radius * radius) put(x, y, colour);
};
const ink = [29, 35, 41];
const accent = [47, 111, 98];
const on = [240, 180, 41];
const off = [120, 190, 230];
// Rounded square background.
for (let y = 0; y < size; y++)
  for (let x = 0; x < size; x++) {
    const dx = Math.max(0, Math.abs(x - 255.5) - 180);
    const dy = Math.max(0, Math.abs(y - 255.5) - 180);
    if (dx * dx + dy * dy <= 76 * 76) put(x, y, ink);
  }
// A ring of ON and OFF events, as an event camera sees a moving edge.
let seed = 7;
const random = () => ((seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
for (let k = 0; k < 420; k++) {
  const angle = random() * 2 * Math.PI;
  const radius = 150 + (random() - 0.5) * 40;
  disc(256 + radius * Math.cos(angle), 256 + radius * Math.sin(angle), 5, random() < 0.5 ? on : off);
}
disc(256, 256, 56, accent);
disc(256, 256, 20, [255, 255, 255]);

const crcTable = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
const crc32 = (bytes) => {
  let c = 0xffffffff;
  for (const b of bytes) c = crcTable[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
};
const chunk = (type, data) => {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, 'ascii');
  Buffer.from(data).copy(out, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
};
const raw = Buffer.alloc(size * (size * 4 + 1));
for (let y = 0; y < size; y++) Buffer.from(rgba.subarray(y * size * 4, (y + 1) * size * 4)).copy(raw, y * (size * 4 + 1) + 1);
const header = Buffer.alloc(13);
header.writeUInt32BE(size, 0);
header.writeUInt32BE(size, 4);
header.set([8, 6, 0, 0, 0], 8);
const png = Buffer.concat([Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]), chunk('IHDR', header), chunk('IDAT', deflateSync(raw)), chunk('IEND', Buffer.alloc(0))]);
writeFileSync(new URL('../resources/icon.png', import.meta.url), png);
