/**
 * Properties of upload processing over whole input spaces: any bytes at all are either taken or
 * refused with a 4xx and one of the contract's sentences — never a crash — and any name is cleaned
 * to something safe to show.
 */
import * as fc from 'fast-check';
import sharp from 'sharp';
import { FILE_LIMITS, FILE_MESSAGES, fileKinds } from '../../shared/schemas/files';
import { HttpError } from '../../server/http-error';
import { cleanName, processUpload } from '../../server/modules/files/process-upload';
import { createPdfWork, type PdfWork } from '../../server/workers/pdf-pool';

let pdf: PdfWork;
beforeAll(() => {
  pdf = createPdfWork();
});
afterAll(async () => pdf?.close());

const SENTENCES = new Set<string>(Object.values(FILE_MESSAGES));
const known = (message: string) => SENTENCES.has(message) || message.startsWith(FILE_MESSAGES.pdfPageMissing);

/** Starts of the files we take, so random tails reach past the sniffer into the decoders. */
const MAGIC = [
  Buffer.from([0xff, 0xd8, 0xff, 0xe0]),
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
  Buffer.from('%PDF-1.7\n'),
  Buffer.alloc(0),
];

describe('any bytes', () => {
  it('are taken as an image of at most the stored size, or refused with a 4xx and a contract sentence', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...MAGIC),
        fc.uint8Array({ minLength: 0, maxLength: 4096 }),
        fc.constantFrom(...fileKinds),
        fc.integer({ min: 1, max: FILE_LIMITS.pdfPages }),
        async (magic, tail, kind, page) => {
          try {
            const out = await processUpload(Buffer.concat([magic, Buffer.from(tail)]), kind, page, pdf);
            expect(Math.max(out.widthPx, out.heightPx)).toBeLessThanOrEqual(FILE_LIMITS.storedSidePx);
          } catch (e) {
            expect(e).toBeInstanceOf(HttpError);
            const err = e as HttpError;
            expect(err.status).toBeGreaterThanOrEqual(400);
            expect(err.status).toBeLessThan(500);
            expect(known(err.message)).toBe(true);
          }
        },
      ),
      { numRuns: 150 },
    );
  }, 120_000);

  it('a real JPEG or PNG of any accepted size comes back upright-sized within the stored side, proportions kept to a pixel', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.integer({ min: 1, max: 6000 }),
        fc.integer({ min: 1, max: 6000 }),
        fc.constantFrom('jpeg' as const, 'png' as const),
        async (w, h, format) => {
          fc.pre(w * h <= 8_000_000); // keep each run quick; the pixel cap itself is pinned in files.test.ts
          const img = sharp({ create: { width: w, height: h, channels: 3, background: '#777' } });
          const bytes = await (format === 'jpeg' ? img.jpeg() : img.png()).toBuffer();
          const out = await processUpload(bytes, 'plan', 1, pdf);
          const scale = Math.min(1, FILE_LIMITS.storedSidePx / Math.max(w, h));
          expect(Math.max(out.widthPx, out.heightPx)).toBeLessThanOrEqual(FILE_LIMITS.storedSidePx);
          expect(Math.abs(out.widthPx - w * scale)).toBeLessThanOrEqual(1);
          expect(Math.abs(out.heightPx - h * scale)).toBeLessThanOrEqual(1);
          expect(out.contentType).toBe(format === 'jpeg' ? 'image/jpeg' : 'image/png');
        },
      ),
      { numRuns: 25 },
    );
  }, 120_000);
});

describe('any file name', () => {
  it('is cleaned to 1–120 characters with no folder, no control or direction-override character', () => {
    fc.assert(
      fc.property(fc.option(fc.string({ unit: 'binary', maxLength: 400 }), { nil: undefined }), (raw) => {
        const name = cleanName(raw, 'photo');
        expect(name.length).toBeGreaterThan(0);
        expect(name.length).toBeLessThanOrEqual(120);
        expect(name).not.toMatch(/[/\\\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/);
      }),
      { numRuns: 2000 },
    );
  });
});
