/**
 * Uploaded files (plan underlays and photos): the API contract shared by the server, the app and
 * the sheet. The bytes live in a storage backend (a folder under the data folder, or S3-compatible
 * object storage); this is what the API says about them.
 *
 * Routes: `POST /api/projects/:id/files` (multipart: field `file`, plus `kind`, and for a photo an
 * optional `placementId`; for a PDF plan an optional `page`) → 201 `{file}`; `GET /api/files/:id`
 * (the bytes), `GET /api/files/:id/thumbnail`, `DELETE /api/files/:id` → 204;
 * `GET /api/projects/:id/files` → `{files}`.
 */
import { z } from 'zod';

export const fileKinds = ['plan', 'photo'] as const;
export type FileKind = (typeof fileKinds)[number];

/** What may be uploaded, decided from the file's bytes. A PDF is allowed for plans only. */
export const uploadContentTypes = ['image/png', 'image/jpeg', 'application/pdf'] as const;
/** What is stored and served: images are re-encoded; a PDF plan is kept as its rasterised page (PNG). */
export const storedContentTypes = ['image/png', 'image/jpeg'] as const;

export const FILE_LIMITS = {
  /** One upload, bytes. */
  fileBytes: 25 * 1024 * 1024,
  /** All of one job's stored files together, bytes. */
  jobBytes: 200 * 1024 * 1024,
  /** Files kept per job. */
  filesPerJob: 200,
  /** Decoded image size, pixels (a decompression bomb is refused before it is decoded). */
  pixels: 60_000_000,
  /** Pages a PDF plan may have. */
  pdfPages: 500,
  /** Longest side of a stored plan raster or photo, pixels. */
  storedSidePx: 4096,
  /** Longest side of a thumbnail, pixels. */
  thumbnailSidePx: 320,
  /** Longest side of a PDF plan's page, inches (2A0 is 66 in; the largest page PDF allows is 200 in). */
  pdfPageSideIn: 72,
  /** Time one PDF page may take to draw, milliseconds. */
  pdfRenderMs: 15_000,
} as const;

export const FILE_MESSAGES = {
  tooLarge: `The file is larger than ${FILE_LIMITS.fileBytes / 1024 / 1024} MB; send a smaller copy (a phone photo at normal quality is well under that).`,
  jobFull: `This job already keeps ${FILE_LIMITS.jobBytes / 1024 / 1024} MB of files; delete some before adding more.`,
  tooMany: `This job already keeps ${FILE_LIMITS.filesPerJob} files; delete some before adding more.`,
  wrongType: 'Only PNG or JPEG images, or a PDF plan, can be attached.',
  pdfPhoto: 'A photo must be a PNG or JPEG image; a PDF can only be a plan.',
  empty: 'The file is empty.',
  unreadable: 'The file could not be read as the image or PDF it claims to be; it may be damaged or cut short.',
  tooManyPixels: 'The image is too large to process (over 60 megapixels).',
  noFile: 'Choose a file to upload (form field "file").',
  pdfPages: `The PDF has more than ${FILE_LIMITS.pdfPages} pages; send only the page with the plan.`,
  pdfPageMissing: 'The PDF has no such page; choose a page it has.',
  pdfPageSize: `The PDF's page is larger than ${FILE_LIMITS.pdfPageSideIn} in (${Math.round(FILE_LIMITS.pdfPageSideIn * 25.4)} mm) on a side, too large for a plan; send a smaller page.`,
  pdfSlow: `The PDF's page took longer than ${FILE_LIMITS.pdfRenderMs / 1000} s to draw, so it was stopped; export the plan as a PNG or JPEG image and send that.`,
  planNoMirror: 'A plan belongs to the whole job; send it without a mirror (placementId).',
  notFound: 'That file was not found. It may have been deleted, or the link is wrong.',
} as const;

export const uploadFields = z.object({
  kind: z.enum(fileKinds, { message: 'Say whether the file is a plan or a photo.' }),
  placementId: z.coerce.number().int('Choose a mirror of this job.').positive('Choose a mirror of this job.').optional(),
  page: z.coerce
    .number()
    .int('The page is a whole number.')
    .min(1, 'Pages count from 1.')
    .max(FILE_LIMITS.pdfPages, `A plan can be taken from page ${FILE_LIMITS.pdfPages} at most.`)
    .optional(),
});
export type UploadFields = z.infer<typeof uploadFields>;

export const fileDto = z.object({
  id: z.string(),
  projectId: z.number().int(),
  kind: z.enum(fileKinds),
  /** The stored file's type (a PDF plan is stored as a PNG of its page). */
  contentType: z.enum(storedContentTypes),
  /** The stored file's size in bytes. */
  bytes: z.number().int().nonnegative(),
  /** The name the file was uploaded with, cleaned for display. */
  name: z.string(),
  widthPx: z.number().int().positive(),
  heightPx: z.number().int().positive(),
  placementId: z.number().int().nullable(),
  /** For a plan taken from a PDF: the page used and how many pages the PDF had. */
  sourcePage: z.number().int().nullable(),
  sourcePages: z.number().int().nullable(),
  createdAt: z.string(),
  url: z.string(),
  thumbnailUrl: z.string(),
});
export type FileDto = z.infer<typeof fileDto>;

const px = z.number().min(-1e6).max(1e6);
const pxPoint = z.tuple([px, px], { message: 'A point needs x and y.' });

/**
 * A plan underlay in the project's scene (`scene.underlay`). Calibration: two points on the image
 * (pixels, x right, y down) and the real distance between them (metres). Placement: the image's
 * top-left corner lands at `originM` on the plan (metres, y north) and the image is turned by
 * `rotationRad` (anticlockwise) about that corner. Re-calibrating changes only these numbers; the
 * walls, zones and mirrors drawn in metres stay where they are.
 */
export const underlay = z
  .object({
    fileId: z.string().min(1).max(64),
    calibration: z.object({
      aPx: pxPoint,
      bPx: pxPoint,
      distanceM: z
        .number({ message: 'Enter the real distance between the two points.' })
        .positive('The distance must be more than zero.')
        .max(2000, 'A plan distance over 2 km is not a building.'),
    }),
    originM: z.tuple([z.number().min(-1e5).max(1e5), z.number().min(-1e5).max(1e5)]).default([0, 0]),
    rotationRad: z
      .number()
      .min(-2 * Math.PI)
      .max(2 * Math.PI)
      .default(0),
    /** How strongly the underlay shows, 0.1 (faint) to 1 (full). */
    opacity: z.number().min(0.1).max(1).default(0.5),
  })
  .refine((u) => Math.hypot(u.calibration.bPx[0] - u.calibration.aPx[0], u.calibration.bPx[1] - u.calibration.aPx[1]) >= 4, {
    message: 'Pick two points at least a few pixels apart on the plan.',
    path: ['calibration', 'bPx'],
  });
export type Underlay = z.infer<typeof underlay>;
