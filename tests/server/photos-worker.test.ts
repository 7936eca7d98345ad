import fs from 'node:fs';
import path from 'node:path';
import { JimpMime } from 'jimp';
import { DecodeTimeoutError, MAX_PIXELS, PhotoProcessor, isCutShort, isReasonableSize, readImageHeader } from '../../server/lib/photo-worker';
import { flatGreyJpeg, hugeDimensionPng, makeImage, withExif } from '../fixtures/photos/make-images';

describe('readImageHeader', () => {
  it('reads kind and size from the bytes of a JPEG and a PNG', async () => {
    const jpeg = await makeImage(320, 200);
    const png = await makeImage(64, 48, JimpMime.png);

    expect(readImageHeader(jpeg)).toEqual({ kind: 'jpeg', width: 320, height: 200 });
    expect(readImageHeader(png)).toEqual({ kind: 'png', width: 64, height: 48 });
  });

  it('does not recognise a text file whatever its name', () => {
    expect(readImageHeader(Buffer.from('just some notes about soup, renamed to soup.jpg'))).toBeNull();
  });

  it('reads a WebP size from its VP8X header', () => {
    const webp = Buffer.alloc(30);
    webp.write('RIFF', 0, 'ascii');
    webp.write('WEBP', 8, 'ascii');
    webp.write('VP8X', 12, 'ascii');
    webp.writeUIntLE(799, 24, 3);
    webp.writeUIntLE(599, 27, 3);

    expect(readImageHeader(webp)).toEqual({ kind: 'webp', width: 800, height: 600 });
  });

  it.each([
    { name: 'a phone photo of 4000 × 3000', width: 4000, height: 3000, ok: true },
    { name: 'a 60000 × 60000 image', width: 60_000, height: 60_000, ok: false },
    { name: 'a 12001 px wide strip', width: 12_001, height: 10, ok: false },
    { name: 'a 0 px image', width: 0, height: 10, ok: false },
  ])('judges $name', ({ width, height, ok }) => {
    expect(isReasonableSize({ width, height })).toBe(ok);
  });

  it('sees the declared size of a huge-dimension PNG without decoding it', () => {
    const header = readImageHeader(hugeDimensionPng());

    expect(header).toEqual({ kind: 'png', width: 60_000, height: 60_000 });
    expect(isReasonableSize(header!)).toBe(false);
  });
});

// Decoding happens in worker threads that load jimp afresh; on a busy 2-core machine that takes seconds.
jest.setTimeout(120_000);

describe('PhotoProcessor', () => {
  it('makes a large and a thumbnail JPEG within their limits, without the camera metadata', async () => {
    const input = withExif(await makeImage(2000, 1000));
    expect(input.includes('CARBWRIGHT-SECRET-LOCATION')).toBe(true);

    const out = await new PhotoProcessor(1).process(input);

    expect([out.width, out.height]).toEqual([2000, 1000]);
    expect([out.large.width, out.large.height]).toEqual([1600, 800]);
    expect([out.thumb.width, out.thumb.height]).toEqual([400, 200]);
    expect(readImageHeader(out.large.data)).toMatchObject({ kind: 'jpeg', width: 1600 });
    expect(out.large.data.includes('CARBWRIGHT-SECRET-LOCATION')).toBe(false);
    expect(out.large.data.includes('Exif')).toBe(false);
    expect(out.thumb.data.includes('Exif')).toBe(false);
  });

  it('keeps a small PNG at its size and turns it into a JPEG', async () => {
    const out = await new PhotoProcessor(1).process(await makeImage(300, 200, JimpMime.png));

    expect(readImageHeader(out.large.data)).toEqual({ kind: 'jpeg', width: 300, height: 200 });
    expect(readImageHeader(out.thumb.data)).toEqual({ kind: 'jpeg', width: 300, height: 200 });
  });

  it('reads a WebP photo and turns it into JPEG variants', async () => {
    const webp = fs.readFileSync(path.join(__dirname, '../fixtures/photos/gradient-640x400.webp'));
    expect(readImageHeader(webp)).toEqual({ kind: 'webp', width: 640, height: 400 });

    const out = await new PhotoProcessor(1).process(webp);

    expect(readImageHeader(out.large.data)).toEqual({ kind: 'jpeg', width: 640, height: 400 });
    expect(readImageHeader(out.thumb.data)).toEqual({ kind: 'jpeg', width: 400, height: 250 });
  });

  it('rejects a truncated JPEG', async () => {
    const jpeg = await makeImage(800, 600);

    await expect(new PhotoProcessor(1).process(jpeg.subarray(0, 600))).rejects.toThrow();
  });

  it('runs no more than two decodes at once and lets the event loop keep answering meanwhile', async () => {
    const processor = new PhotoProcessor(2);
    const photo = await makeImage(400, 300);
    let peak = 0;
    let ticks = 0;
    const timer = setInterval(() => {
      ticks += 1;
      peak = Math.max(peak, processor.load.running);
    }, 5);

    const results = await Promise.all([1, 2, 3, 4].map(() => processor.process(photo)));
    clearInterval(timer);

    expect(results).toHaveLength(4);
    expect(peak).toBe(2);
    expect(ticks).toBeGreaterThan(5);
    expect(processor.load).toEqual({ running: 0, waiting: 0 });
  });
});

describe('data shorter than its header promises', () => {
  it.each([
    // The shape a probe sent: about 100 bytes claiming 12000 × 3333 (within the size limit, but cut short).
    { name: 'a 100-byte PNG claiming 12000 × 3333', file: () => hugeDimensionPng(12_000, 3_333), cut: true },
    { name: 'a real 320 × 200 PNG', file: () => makeImage(320, 200, JimpMime.png), cut: false },
    { name: 'a real 320 × 200 JPEG', file: () => makeImage(320, 200), cut: false },
    { name: 'a hand-built flat 2000 × 1500 JPEG (2 bits a block)', file: () => flatGreyJpeg(2000, 1500), cut: false },
    { name: 'the same JPEG with most of its data gone', file: () => flatGreyJpeg(2000, 1500).subarray(0, 1000), cut: true },
    { name: 'a real WebP', file: () => fs.readFileSync(path.join(__dirname, '../fixtures/photos/gradient-640x400.webp')), cut: false },
    { name: 'a WebP cut to half its RIFF length', file: () => { const w = fs.readFileSync(path.join(__dirname, '../fixtures/photos/gradient-640x400.webp')); return w.subarray(0, w.length >> 1); }, cut: true },
  ])('$name: cut short = $cut', async ({ file, cut }) => {
    const buf = await file();
    const header = readImageHeader(buf)!;
    expect(header).not.toBeNull();
    expect(isCutShort(buf, header)).toBe(cut);
  });
});

describe('the decode time limit', () => {
  it('stops a decode that runs past it', async () => {
    const slow = new PhotoProcessor(1, 5);

    await expect(slow.process(await makeImage(800, 600))).rejects.toBeInstanceOf(DecodeTimeoutError);
    expect(slow.load).toEqual({ running: 0, waiting: 0 });
  });
});

describe('the documented 40-megapixel limit and the decoder agree', () => {
  it('decodes a 36-megapixel JPEG (three full-resolution components, the most decoder memory per pixel)', async () => {
    const photo = flatGreyJpeg(7_200, 5_000);
    expect(isReasonableSize(readImageHeader(photo)!)).toBe(true);

    const out = await new PhotoProcessor(1, 120_000).process(photo);

    expect([out.width, out.height]).toEqual([7_200, 5_000]);
    expect([out.large.width, out.large.height]).toEqual([1600, 1111]);
  });

  it('refuses a photo just over 40 megapixels before decoding, naming the limit', () => {
    expect(MAX_PIXELS).toBe(40_000_000);
    expect(isReasonableSize({ width: 8_000, height: 5_001 })).toBe(false);
    expect(isReasonableSize({ width: 8_000, height: 5_000 })).toBe(true);
  });
});
