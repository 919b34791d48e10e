import { z } from 'zod';
import { text } from './numbers';

/** POST /api/recipes/:id/versions/:n/attachments — the text fields that travel with the photo. */
export const attachmentFields = z.strictObject({
  role: z.enum(['setup', 'good-face', 'bad-face', 'other'], { error: 'Say what the photo shows: setup, good-face, bad-face or other.' }).default('other'),
  caption: text('Caption', 300).default(''),
});
export type AttachmentFields = z.infer<typeof attachmentFields>;
