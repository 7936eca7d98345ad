import path from 'node:path';
import { Worker } from 'node:worker_threads';

export type ImageKind = 'jpeg' | 'png' | 'webp';
export type ImageHeader = { kind: ImageKind; width: number; height: number };

/** Refuse anything wider or taller than this, or with more pixels than MAX_PIXELS, before decoding. */
export const MAX_SIDE = 12_000;
export const MAX_PIXELS = 40_000_000;
/**
 * The JPEG decoder's (jpeg-js) memory cap, sized so every image within MAX_PIXELS decodes: it counts 4 bytes of
 * coefficients and 1 byte of line buffer per pixel per component (3 components, no subsampling, the worst case) and
 * 4 bytes of output per pixel: 19 bytes a pixel, 760 MB at 40 MP (its default of 512 MB refused 36 MP photos).
 */
export const JPEG_DECODE_MEMORY_MB = Math.ceil((MAX_PIXELS * 19) / 1_000_000) + 64;
/** How long one decode may take before its worker is stopped. */
export const DECODE_TIME_LIMIT_MS = 30_000;

function jpegSize(buf: Buffer): { width: number; height: number } | null {
  let i = 2;
  while (i + 9 < buf.length) {
    if (buf[i] !== 0xff) return null;
    const marker = buf[i + 1];
    if (marker === 0xff) {
      i += 1;
      continue;
    }
    if (marker === 0xd8 || marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      i += 2;
      continue;
    }
    const length = buf.readUInt16BE(i + 2);
    const isFrame = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
    if (isFrame) return { height: buf.readUInt16BE(i + 5), width: buf.readUInt16BE(i + 7) };
    i += 2 + length;
  }
  return null;
}

function webpSize(buf: Buffer): { width: number; height: number } | null {
  const chunk = buf.toString('ascii', 12, 16);
  if (chunk === 'VP8X' && buf.length >= 30) return { width: 1 + buf.readUIntLE(24, 3), height: 1 + buf.readUIntLE(27, 3) };
  if (chunk === 'VP8L' && buf.length >= 25) {
    const bits = buf.readUInt32LE(21);
    return { width: 1 + (bits & 0x3fff), height: 1 + ((bits >> 14) & 0x3fff) };
  }
  if (chunk === 'VP8 ' && buf.length >= 30) return { width: buf.readUInt16LE(26) & 0x3fff, height: buf.readUInt16LE(28) & 0x3fff };
  return null;
}

/** What the bytes really are (never the file name or the declared type), with the declared pixel size; null if neither. */
export function readImageHeader(buf: Buffer): ImageHeader | null {
  if (buf.length >= 4 && buf[0] === 0xff && buf[1] === 0xd8 && buf[2] === 0xff) {
    const size = jpegSize(buf);
    return size ? { kind: 'jpeg', ...size } : null;
  }
  if (buf.length >= 24 && buf.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))) {
    if (buf.toString('ascii', 12, 16) !== 'IHDR') return null;
    return { kind: 'png', width: buf.readUInt32BE(16), height: buf.readUInt32BE(20) };
  }
  if (buf.length >= 16 && buf.toString('ascii', 0, 4) === 'RIFF' && buf.toString('ascii', 8, 12) === 'WEBP') {
    const size = webpSize(buf);
    return size ? { kind: 'webp', ...size } : null;
  }
  return null;
}

// Deflate cannot shrink data more than 1032 to 1 (zlib technical details, from memory), so a PNG holds at least
// its raw scanlines / 1032 bytes. A baseline or progressive JPEG spends at least one bit per 8×8 block of its first
// component. A WebP's RIFF header states its own length.
const PNG_CHANNELS: Record<number, number> = { 0: 1, 2: 3, 3: 1, 4: 2, 6: 4 };
const DEFLATE_MAX_RATIO = 1032;

/** The fewest bytes a file of this kind and declared size can have; shorter data was cut short or lies about its size. */
export function minimumBytes(buf: Buffer, h: ImageHeader): number {
  if (h.kind === 'png') {
    const bits = (buf[24] ?? 8) * (PNG_CHANNELS[buf[25] ?? 6] ?? 4);
    const raw = h.height * (1 + Math.ceil((h.width * bits) / 8));
    return Math.floor(raw / DEFLATE_MAX_RATIO);
  }
  if (h.kind === 'jpeg') return Math.floor((Math.ceil(h.width / 8) * Math.ceil(h.height / 8)) / 8);
  return buf.length >= 8 ? buf.readUInt32LE(4) + 8 : Number.POSITIVE_INFINITY;
}

/** True when the data is shorter than its header promises. */
export function isCutShort(buf: Buffer, h: ImageHeader): boolean {
  return buf.length < minimumBytes(buf, h);
}

/** True when the declared size is within what Carbwright will decode. */
export function isReasonableSize(h: Pick<ImageHeader, 'width' | 'height'>): boolean {
  return h.width > 0 && h.height > 0 && h.width <= MAX_SIDE && h.height <= MAX_SIDE && h.width * h.height <= MAX_PIXELS;
}

export type PhotoVariant = { data: Buffer; width: number; height: number };
export type ProcessedPhoto = { width: number; height: number; large: PhotoVariant; thumb: PhotoVariant };

const WORKER_FILE = path.join(__dirname, 'photo-worker.thread.js');
const LIMITS = { largeMax: 1600, thumbMax: 400, quality: 82, jpegMemoryMb: JPEG_DECODE_MEMORY_MB, maxMegapixels: MAX_PIXELS / 1_000_000 };

/** Runs at most `concurrency` decodes at once (each in its own worker thread); the rest wait their turn. */
export class PhotoProcessor {
  private running = 0;
  private readonly waiting: (() => void)[] = [];

  constructor(
    private readonly concurrency = 2,
    private readonly timeLimitMs = DECODE_TIME_LIMIT_MS,
  ) {}

  /** Decodes and re-encodes one photo off the request thread; rejects when jimp cannot decode it. */
  async process(input: Buffer): Promise<ProcessedPhoto> {
    if (this.running >= this.concurrency) await new Promise<void>((resolve) => this.waiting.push(resolve));
    this.running += 1;
    try {
      return await runWorker(input, this.timeLimitMs);
    } finally {
      this.running -= 1;
      this.waiting.shift()?.();
    }
  }

  /** How many decodes are running and waiting (for tests and logs). */
  get load() {
    return { running: this.running, waiting: this.waiting.length };
  }
}

/** Thrown when a decode runs past its time limit (its worker is stopped). */
export class DecodeTimeoutError extends Error {}

function runWorker(input: Buffer, timeLimitMs: number): Promise<ProcessedPhoto> {
  return new Promise((resolve, reject) => {
    const copy = new Uint8Array(input);
    const worker = new Worker(WORKER_FILE, {
      workerData: { input: copy, ...LIMITS },
      transferList: [copy.buffer],
      resourceLimits: { maxOldGenerationSizeMb: 1024 },
    });
    let settled = false;
    const timer = setTimeout(() => {
      settled = true;
      void worker.terminate();
      reject(new DecodeTimeoutError(`photo decode took longer than ${timeLimitMs} ms`));
    }, timeLimitMs);
    worker.once('message', (msg: { ok: boolean; message?: string; result?: ProcessedPhoto }) => {
      if (settled) return;
      settled = true;
      clearTimeout(timer);
      void worker.terminate();
      if (!msg.ok || !msg.result) return reject(new Error(msg.message ?? 'could not decode'));
      const { result } = msg;
      const toBuffer = (v: PhotoVariant) => ({ ...v, data: Buffer.from(v.data) });
      resolve({ ...result, large: toBuffer(result.large), thumb: toBuffer(result.thumb) });
    });
    worker.once('error', (err) => {
      clearTimeout(timer);
      if (!settled) reject(err);
      settled = true;
    });
    worker.once('exit', (code) => {
      clearTimeout(timer);
      if (!settled) reject(new Error(`photo worker stopped (${code})`));
      settled = true;
    });
  });
}
