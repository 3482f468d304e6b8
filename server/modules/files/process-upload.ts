/**
 * What an upload becomes before anything is stored: its type decided from its bytes (file-type),
 * images decoded and re-encoded by sharp (EXIF orientation applied, then every metadata block
 * dropped — location included — and anything after the image's end left behind), the longest side
 * brought within `FILE_LIMITS.storedSidePx`, and a thumbnail. A PDF plan's page is drawn on the
 * PDF worker (pdf-pool.ts) and kept as a PNG.
 */
import sharp from 'sharp';
import { fromBuffer } from 'file-type';
import { FILE_LIMITS, FILE_MESSAGES, type FileKind } from '../../../shared/schemas/files';
import { HttpError } from '../../http-error';
import type { PdfWork } from '../../workers/pdf-pool';

export interface ProcessedUpload {
  data: Buffer;
  contentType: 'image/png' | 'image/jpeg';
  widthPx: number;
  heightPx: number;
  thumbnail: Buffer;
  sourcePage: number | null;
  sourcePages: number | null;
}

const refuse = (status: number, sentence: string) => new HttpError(status, sentence, { file: sentence });

/** JPEG quality of stored photos and thumbnails (common practice for photos viewed on screen: docs/sources.md, *Uploaded files*). */
const PHOTO_QUALITY = 85;
const THUMBNAIL_QUALITY = 75;

/** The type the bytes say, or undefined for anything we do not take. */
export async function sniff(data: Buffer): Promise<'image/png' | 'image/jpeg' | 'application/pdf' | undefined> {
  let found: Awaited<ReturnType<typeof fromBuffer>>;
  try {
    found = await fromBuffer(data);
  } catch {
    // file-type runs off the end of a file cut short inside its header (a bare PNG signature).
    throw refuse(422, FILE_MESSAGES.unreadable);
  }
  const mime = found?.mime;
  return mime === 'image/png' || mime === 'image/jpeg' || mime === 'application/pdf' ? mime : undefined;
}

export async function processUpload(data: Buffer, kind: FileKind, page: number, pdf: PdfWork): Promise<ProcessedUpload> {
  if (data.length === 0) throw refuse(400, FILE_MESSAGES.empty);
  const type = await sniff(data);
  if (!type) throw refuse(415, FILE_MESSAGES.wrongType);
  if (type === 'application/pdf') {
    if (kind !== 'plan') throw refuse(415, FILE_MESSAGES.pdfPhoto);
    const drawn = await pdf.rasterise(data, page);
    const png = Buffer.from(drawn.png.buffer, drawn.png.byteOffset, drawn.png.byteLength);
    return {
      data: png,
      contentType: 'image/png',
      widthPx: drawn.widthPx,
      heightPx: drawn.heightPx,
      thumbnail: await thumbnailOf(png),
      sourcePage: page,
      sourcePages: drawn.pages,
    };
  }
  return processImage(data, type);
}

/** An image as an upload keeps it: re-encoded (see `reencode`) with its thumbnail. */
export async function processImage(data: Buffer, type: 'image/png' | 'image/jpeg'): Promise<ProcessedUpload> {
  const image = await reencode(data, type);
  return { ...image, thumbnail: await thumbnailOf(image.data), sourcePage: null, sourcePages: null };
}

/** Decode, turn upright, shrink to the stored size, encode afresh; nothing of the original file survives but its pixels. */
export async function reencode(
  data: Buffer,
  type: 'image/png' | 'image/jpeg',
): Promise<{ data: Buffer; contentType: 'image/png' | 'image/jpeg'; widthPx: number; heightPx: number }> {
  let meta: sharp.Metadata;
  try {
    // Only the header is read here (no decoding), so no pixel limit yet: the size check below says why.
    meta = await sharp(data, { limitInputPixels: false }).metadata();
  } catch {
    throw refuse(422, FILE_MESSAGES.unreadable);
  }
  // The header's size, read before any decoding: a decompression bomb is refused here.
  if (!meta.width || !meta.height) throw refuse(422, FILE_MESSAGES.unreadable);
  if (meta.width * meta.height > FILE_LIMITS.pixels) throw refuse(413, FILE_MESSAGES.tooManyPixels);
  if (meta.format !== (type === 'image/png' ? 'png' : 'jpeg')) throw refuse(422, FILE_MESSAGES.unreadable);
  try {
    // failOn 'warning': a JPEG cut short ("premature end") or a damaged PNG is refused, not half-stored.
    const pipeline = sharp(data, { limitInputPixels: FILE_LIMITS.pixels, failOn: 'warning' })
      .rotate()
      .resize({ width: FILE_LIMITS.storedSidePx, height: FILE_LIMITS.storedSidePx, fit: 'inside', withoutEnlargement: true });
    const out =
      type === 'image/jpeg'
        ? await pipeline.jpeg({ quality: PHOTO_QUALITY, mozjpeg: false }).toBuffer({ resolveWithObject: true })
        : await pipeline.png({ compressionLevel: 6 }).toBuffer({ resolveWithObject: true });
    return { data: out.data, contentType: type, widthPx: out.info.width, heightPx: out.info.height };
  } catch (e) {
    if (/pixel limit/i.test((e as Error).message ?? '')) throw refuse(413, FILE_MESSAGES.tooManyPixels);
    throw refuse(422, FILE_MESSAGES.unreadable);
  }
}

/** A small JPEG on white (a transparent PNG plan's thumbnail is flattened). */
async function thumbnailOf(stored: Buffer): Promise<Buffer> {
  return sharp(stored, { limitInputPixels: FILE_LIMITS.pixels })
    .resize({ width: FILE_LIMITS.thumbnailSidePx, height: FILE_LIMITS.thumbnailSidePx, fit: 'inside', withoutEnlargement: true })
    .flatten({ background: '#ffffff' })
    .jpeg({ quality: THUMBNAIL_QUALITY })
    .toBuffer();
}

/** The uploaded name, for display only: no folders, no control characters, at most 120 characters. */
export function cleanName(raw: string | undefined, fallback: string): string {
  const base = (raw ?? '').split(/[\\/]/).pop() ?? '';
  const clean = base.replace(/[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g, '').trim();
  return (clean || fallback).slice(0, 120);
}
