/** The path parameters of the API's routes (`:id`, `:n`, …), as the router validates them. */
import { z } from 'zod';
import { idParam } from './fields';
import { checkCodeParam } from './operator';

/** `/…/:id` — a record's id. */
export const idParams = z.strictObject({ id: idParam });

/** `/api/recipes/:id/versions/:n` — a recipe and one of its version numbers. */
export const versionParams = z.strictObject({ id: idParam, n: idParam });

/** `/api/recipes/:id/versions/:n/attachments/:attachmentId` */
export const versionAttachmentParams = z.strictObject({ id: idParam, n: idParam, attachmentId: idParam });

/** `/api/cuts/:cutId` */
export const cutParams = z.strictObject({ cutId: idParam });

/** `/api/check/:code` — the check code printed on a bench sheet. */
export const checkCodeParams = z.strictObject({ code: checkCodeParam });
