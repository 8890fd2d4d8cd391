// A small PNG reader for the browser suites: 8-bit greyscale, RGB and RGBA, non-interlaced
// (what Chromium writes), following the PNG specification (W3C/ISO 15948): chunks, zlib-
// compressed IDAT, and the five per-row filters. Enough to ask whether a screenshot is blank.
import { inflateSync } from "node:zlib";

export interface DecodedPng {
  width: number;
  height: number;
  channels: number;
  pixels: Uint8Array;
}

const SIGNATURE = [137, 80, 78, 71, 13, 10, 26, 10];

export function decodePng(buf: Buffer): DecodedPng {
  if (!SIGNATURE.every((b, i) => buf[i] === b)) throw new Error("not a PNG (bad signature)");
  let pos = 8;
  let width = 0;
  let height = 0;
  let channels = 0;
  const idat: Buffer[] = [];
  while (pos < buf.length) {
    const len = buf.readUInt32BE(pos);
    const type = buf.toString("latin1", pos + 4, pos + 8);
    const data = buf.subarray(pos + 8, pos + 8 + len);
    if (type === "IHDR") {
      width = data.readUInt32BE(0);
      height = data.readUInt32BE(4);
      const depth = data[8];
      const colour = data[9];
      if (depth !== 8 || data[12] !== 0) throw new Error(`unsupported PNG: bit depth ${depth}, interlace ${data[12]}`);
      channels = ({ 0: 1, 2: 3, 4: 2, 6: 4 } as Record<number, number>)[colour] ?? 0;
      if (channels === 0) throw new Error(`unsupported PNG colour type ${colour}`);
    } else if (type === "IDAT") idat.push(data);
    else if (type === "IEND") break;
    pos += 12 + len;
  }
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * channels;
  const pixels = new Uint8Array(height * stride);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)];
    const src = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    const out = pixels.subarray(y * stride, (y + 1) * stride);
    const prev = y > 0 ? pixels.subarray((y - 1) * stride, y * stride) : new Uint8Array(stride);
    for (let i = 0; i < stride; i++) {
      const a = i >= channels ? out[i - channels] : 0;
      const b = prev[i];
      const c = i >= channels ? prev[i - channels] : 0;
      let v: number;
      switch (filter) {
        case 0:
          v = 0;
          break;
        case 1:
          v = a;
          break;
        case 2:
          v = b;
          break;
        case 3:
          v = (a + b) >> 1;
          break;
        case 4: {
          const p = a + b - c;
          const pa = Math.abs(p - a);
          const pb = Math.abs(p - b);
          const pc = Math.abs(p - c);
          v = pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
          break;
        }
        default:
          throw new Error(`bad PNG filter ${filter} on row ${y}`);
      }
      out[i] = (src[i] + v) & 0xff;
    }
  }
  return { width, height, channels, pixels };
}

/** How many distinct colours a picture has, and the share of pixels that are not the commonest. */
export function pixelVariety(png: DecodedPng): { colours: number; offBackground: number } {
  const counts = new Map<number, number>();
  const { pixels, channels } = png;
  for (let i = 0; i < pixels.length; i += channels) {
    let key = 0;
    for (let c = 0; c < Math.min(channels, 3); c++) key = key * 256 + pixels[i + c];
    counts.set(key, (counts.get(key) ?? 0) + 1);
  }
  const total = pixels.length / channels;
  const commonest = Math.max(...counts.values());
  return { colours: counts.size, offBackground: 1 - commonest / total };
}
