import { z } from 'zod';
import { email } from './common';
import { sheetEmailRules } from './rules';
import { zodText } from './zod-rules';

/** Paper the sheet is printed on; the default follows the project's units (imperial → US Letter). */
export const sheetPapers = ['a4', 'letter'] as const;
export type SheetPaper = (typeof sheetPapers)[number];
export const sheetQuery = z.object({
  paper: z.enum(sheetPapers, { message: 'Choose a4 or letter paper.' }).optional(),
});

/** `GET …/sheet.pdf?revision=3`: an issued revision by number; without it, the latest issued one. */
export const sheetPdfQuery = sheetQuery.extend({
  revision: z
    .string()
    .regex(/^[1-9][0-9]{0,8}$/, 'A revision is a whole number like 3.')
    .transform(Number)
    .optional(),
});

/** `GET …/sheet/recipient?to=…`: whether sending to this address counts as leaving the organisation. */
export const sheetRecipientQuery = z.object({ to: email }).strict();
export const sheetRecipientDto = z.object({
  /** The address is not a user of the project's organisation: the same rule the hourly limit counts by. */
  outsideOrganisation: z.boolean(),
});
export type SheetRecipientDto = z.infer<typeof sheetRecipientDto>;

/** One buyer address per sending: a purchase request goes to one desk. */
export const sheetEmailBody = z
  .object({
    to: email,
    message: zodText(sheetEmailRules.note).optional(),
  })
  .strict();
export type SheetEmailBody = z.input<typeof sheetEmailBody>;

export const sheetRevisionDto = z.object({
  number: z.number(),
  contentHash: z.string(),
  issuedAt: z.string(),
  issuedBy: z.string(),
});
export type SheetRevisionDto = z.infer<typeof sheetRevisionDto>;

export const sheetStatusDto = z.object({
  revisions: z.array(sheetRevisionDto),
  current: z.object({
    number: z.number(),
    contentHash: z.string(),
    changedSinceLast: z.boolean(),
    /** true when the job is approved and the current content is the approved content (the sheet carries no not-approved band). */
    approved: z.boolean(),
  }),
  filename: z.string(),
});
export type SheetStatusDto = z.infer<typeof sheetStatusDto>;

/** `POST …/sheet/revisions`: the revision that now holds the current content, and whether it is new. */
export const sheetIssueResponse = z.object({ revision: sheetRevisionDto, created: z.boolean(), filename: z.string() });
export type SheetIssueResponse = z.infer<typeof sheetIssueResponse>;

/** `sent`: the mail server accepted it; `queued`: stored and retried until the server takes it. */
export const sheetEmailResponse = z.object({
  revision: sheetRevisionDto,
  to: z.string(),
  filename: z.string(),
  delivery: z.enum(['sent', 'queued']),
  /** Whether the sheet sent carries the approval (false: every page says it is not approved). */
  approved: z.boolean(),
  /** The address is not a user of the organisation (these sendings are limited per hour). */
  outsideOrganisation: z.boolean(),
});
export type SheetEmailResponse = z.infer<typeof sheetEmailResponse>;
