import path from 'node:path';
import { Worker } from 'node:worker_threads';

export type ImageKind = 'jpeg' | 'png' | 'webp';
export type ImageHeader = { kind: ImageKind; width: number; height: number };

/** Refuse anything wider or taller than this, or with more pixels than MAX_PIXELS, before decoding. */
export const MAX_SIDE = 12_000;
export const MAX_PIXELS = 40_000_000;

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

/** True when the declared size is within what Carbwright will decode. */
export function isReasonableSize(h: Pick<ImageHeader, 'width' | 'height'>): boolean {
  return h.width > 0 && h.height > 0 && h.width <= MAX_SIDE && h.height <= MAX_SIDE && h.width * h.height <= MAX_PIXELS;
}

export type PhotoVariant = { data: Buffer; width: number; height: number };
export type ProcessedPhoto = { width: number; height: number; large: PhotoVariant; thumb: PhotoVariant };

const WORKER_FILE = path.join(__dirname, 'photo-worker.thread.js');
const LIMITS = { largeMax: 1600, thumbMax: 400, quality: 82 };

/** Runs at most `concurrency` decodes at once (each in its own worker thread); the rest wait their turn. */
export class PhotoProcessor {
  private running = 0;
  private readonly waiting: (() => void)[] = [];

  constructor(private readonly concurrency = 2) {}

  /** Decodes and re-encodes one photo off the request thread; rejects when jimp cannot decode it. */
  async process(input: Buffer): Promise<ProcessedPhoto> {
    if (this.running >= this.concurrency) await new Promise<void>((resolve) => this.waiting.push(resolve));
    this.running += 1;
    try {
      return await runWorker(input);
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

function runWorker(input: Buffer): Promise<ProcessedPhoto> {
  return new Promise((resolve, reject) => {
    const copy = new Uint8Array(input);
    const worker = new Worker(WORKER_FILE, {
      workerData: { input: copy, ...LIMITS },
      transferList: [copy.buffer],
      resourceLimits: { maxOldGenerationSizeMb: 1024 },
    });
    let settled = false;
    worker.once('message', (msg: { ok: boolean; message?: string; result?: ProcessedPhoto }) => {
      settled = true;
      void worker.terminate();
      if (!msg.ok || !msg.result) return reject(new Error(msg.message ?? 'could not decode'));
      const { result } = msg;
      const toBuffer = (v: PhotoVariant) => ({ ...v, data: Buffer.from(v.data) });
      resolve({ ...result, large: toBuffer(result.large), thumb: toBuffer(result.thumb) });
    });
    worker.once('error', (err) => {
      if (!settled) reject(err);
    });
    worker.once('exit', (code) => {
      if (!settled) reject(new Error(`photo worker stopped (${code})`));
    });
  });
}
