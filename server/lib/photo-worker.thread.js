// Runs in a worker thread (plain JavaScript so it loads the same under node, tsx and jest):
// decodes one photo with jimp, flattens transparency onto white, and re-encodes a large and a
// thumbnail JPEG. Re-encoding keeps only pixels, so camera metadata (EXIF, GPS location) is dropped.
const fs = require('node:fs');
const { fileURLToPath } = require('node:url');
const { parentPort, workerData } = require('node:worker_threads');

// The WebP codec loads its WebAssembly with fetch(file://…), which Node 20 cannot do; serve those
// reads from disk inside this worker only.
const networkFetch = globalThis.fetch;
globalThis.fetch = async (input, init) => {
  const url = String(typeof input === 'object' && input && 'url' in input ? input.url : input);
  if (url.startsWith('file:')) {
    return new Response(fs.readFileSync(fileURLToPath(url)), { headers: { 'content-type': 'application/wasm' } });
  }
  return networkFetch(input, init);
};

async function loadJimp() {
  const [{ default: webp }, { createJimp }, { defaultFormats, defaultPlugins, JimpMime }] = await Promise.all([
    import('@jimp/wasm-webp'),
    import('@jimp/core'),
    import('jimp'),
  ]);
  return { Jimp: createJimp({ formats: [...defaultFormats, webp], plugins: defaultPlugins }), JimpMime };
}

async function run({ input, largeMax, thumbMax, quality, jpegMemoryMb, maxMegapixels }) {
  const { Jimp, JimpMime } = await loadJimp();
  // jpeg-js's own caps, set to the size limit the server promises (its defaults refuse some photos within it).
  const decoded = await Jimp.fromBuffer(Buffer.from(input), {
    [JimpMime.jpeg]: { maxMemoryUsageInMB: jpegMemoryMb, maxResolutionInMP: maxMegapixels },
  });
  const { width, height } = decoded.bitmap;
  // JPEG has no transparency; anything else is flattened onto white. One full-size copy at most, then smaller ones.
  let large = decoded;
  if (decoded.mime !== JimpMime.jpeg) {
    large = new Jimp({ width, height, color: 0xffffffff });
    large.composite(decoded, 0, 0);
  }
  if (width > largeMax || height > largeMax) large.scaleToFit({ w: largeMax, h: largeMax });
  const thumb = large.clone();
  if (thumb.bitmap.width > thumbMax || thumb.bitmap.height > thumbMax) thumb.scaleToFit({ w: thumbMax, h: thumbMax });
  const largeJpeg = await large.getBuffer(JimpMime.jpeg, { quality });
  const thumbJpeg = await thumb.getBuffer(JimpMime.jpeg, { quality });
  return {
    width,
    height,
    large: { data: largeJpeg, width: large.bitmap.width, height: large.bitmap.height },
    thumb: { data: thumbJpeg, width: thumb.bitmap.width, height: thumb.bitmap.height },
  };
}

run(workerData)
  .then((result) => parentPort.postMessage({ ok: true, result }))
  .catch((err) => parentPort.postMessage({ ok: false, message: String((err && err.message) || err) }));
