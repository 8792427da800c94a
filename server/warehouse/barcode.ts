import bwipjs from 'bwip-js/node';

const cache = new Map<string, string>();

/** A Code 128 barcode of a code (a SKU) as an SVG data URI; an image, so the page's style policy is not involved. */
export function barcodeDataUri(code: string): string {
  const hit = cache.get(code);
  if (hit) return hit;
  const svg = bwipjs.toSVG({ bcid: 'code128', text: code, scale: 2, height: 9, includetext: true, textxalign: 'center' });
  const uri = `data:image/svg+xml;base64,${Buffer.from(svg).toString('base64')}`;
  // SKUs are few and stable; the cache stays small.
  if (cache.size < 5_000) cache.set(code, uri);
  return uri;
}
