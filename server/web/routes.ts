/**
 * Every API route, one line each: method, path, what it does, who may call it, the schemas
 * of the request parts it reads, what it answers, handler. The router (which validates the
 * declared parts before the handler), the API reference (GET /api/openapi.json) and the
 * role-walk test are all built from this table. Within a path, specific routes come before
 * parameterised ones.
 */
import { attachmentFields } from '../../shared/schemas/attachment';
import { labSettingsBody } from '../../shared/schemas/lab-settings';
import { forgotPasswordBody, linkTokenBody, notificationPreferencesBody, setPasswordBody } from '../../shared/schemas/mail';
import { cutRecordBody, cutSearchQuery, finderQuery } from '../../shared/schemas/operator';
import { checkCodeParams, cutParams, idParams, versionAttachmentParams, versionParams } from '../../shared/schemas/params';
import { createRecipeBody, recipeListQuery, saveDraftBody } from '../../shared/schemas/recipe';
import { changePasswordBody, preferencesBody, signInBody } from '../../shared/schemas/session';
import { machineBody, materialBody, selectionRowBody, stockListQuery, wheelBody } from '../../shared/schemas/stock';
import { createUserBody, inviteBody, temporaryPasswordBody, updateUserBody, userListQuery } from '../../shared/schemas/users';
import { approveBody, trailQuery, commentBody, compareQuery, newVersionBody, returnBody, submitBody, withdrawBody } from '../../shared/schemas/workflow';
import * as acknowledgements from './handlers/acknowledgements';
import * as attachments from './handlers/attachments';
import * as benchSheet from './handlers/bench-sheet';
import * as checkCodes from './handlers/check-codes';
import * as compare from './handlers/compare';
import * as cuts from './handlers/cuts';
import * as devOutbox from './handlers/dev-outbox';
import * as finder from './handlers/finder';
import * as health from './handlers/health';
import * as notifications from './handlers/notifications';
import * as openapi from './handlers/openapi';
import * as passwordLinks from './handlers/password-links';
import * as recipes from './handlers/recipes';
import * as selectionRows from './handlers/selection-rows';
import * as session from './handlers/session';
import * as settings from './handlers/settings';
import * as speedMismatches from './handlers/speed-mismatches';
import { machines, materials, wheels } from './handlers/stock';
import * as today from './handlers/today';
import * as trail from './handlers/trail';
import * as users from './handlers/users';
import * as workflow from './handlers/workflow';
import type { RouteDefinition, UndeclaredInput } from './route-definition';

/** Who edits stock: authors, who write recipes against it, and admins who keep the lab's lists. */
const STOCK_EDITORS = ['author', 'admin'] as const;

// One line per route, however long: the table reads as a table (Prettier leaves it alone).
// prettier-ignore
const table = [
  { method: 'get', path: '/api/health', summary: 'Whether the server and its database answer (for load balancers); 503 when the database does not.', access: 'public', answers: '200 json: { ok: true }', handler: health.check },
  { method: 'get', path: '/api/openapi.json', summary: 'This API reference: an OpenAPI 3.1 document generated from the route table.', access: 'signedIn', answers: '200 json: the OpenAPI document', handler: openapi.document },

  // Session: the routes someone with a temporary password can still use.
  { method: 'get', path: '/api/session/csrf', summary: 'A CSRF token for an anonymous session (needed to sign in).', access: 'public', answers: '200 json: CsrfDto', handler: session.issueCsrfToken, whilePasswordChangeRequired: true },
  { method: 'get', path: '/api/session', summary: 'Who is signed in, with a fresh CSRF token.', access: 'signedIn', answers: '200 json: SessionDto', handler: session.current, whilePasswordChangeRequired: true },
  { method: 'post', path: '/api/session', summary: 'Sign in with username and password (repeated failures are slowed down and then refused for a while).', access: 'public', body: signInBody, answers: '200 json: SessionDto with the token of the new session', handler: session.signIn, whilePasswordChangeRequired: true },
  { method: 'delete', path: '/api/session', summary: 'Sign out.', access: 'signedIn', answers: '204', handler: session.signOut, whilePasswordChangeRequired: true },
  { method: 'post', path: '/api/session/password', summary: 'Change one\'s own password; every other session of the person ends. Wrong current passwords count toward the person\'s limit shared with signatures (5 in 15 minutes, then 429).', access: 'signedIn', body: changePasswordBody, answers: '200 json: SessionDto', handler: session.changePassword, whilePasswordChangeRequired: true },
  { method: 'patch', path: '/api/session/preferences', summary: 'Set one\'s own units (metric, or metric with imperial beside it).', access: 'signedIn', body: preferencesBody, answers: '200 json: SessionDto', handler: session.updatePreferences },
  { method: 'get', path: '/api/session/notifications', summary: 'The mails the signed-in person gets, each on or off.', access: 'signedIn', answers: '200 json: NotificationPreferencesDto', handler: notifications.get },
  { method: 'patch', path: '/api/session/notifications', summary: 'Turn optional mails on or off (the request to acknowledge a new version cannot be turned off).', access: 'signedIn', body: notificationPreferencesBody, answers: '200 json: NotificationPreferencesDto', handler: notifications.update },

  // Single-use links from mails (invitation 72 h, password reset 1 h). "Forgot" answers the same for any address.
  { method: 'post', path: '/api/password/forgot', summary: 'Ask for a password-reset mail; the same answer, after the same time, whether or not the address is known.', access: 'public', body: forgotPasswordBody, answers: '202 json: MessageDto', handler: passwordLinks.forgot },
  { method: 'post', path: '/api/password/link', summary: 'What a link from a mail is for, or why it no longer works.', access: 'public', body: linkTokenBody, answers: '200 json: LinkInfoDto', handler: passwordLinks.inspect },
  { method: 'post', path: '/api/password/set', summary: 'Use an invitation or reset link once to set a password.', access: 'public', body: setPasswordBody, answers: '200 json: MessageDto', handler: passwordLinks.set },

  // People (admin).
  { method: 'get', path: '/api/users', summary: 'People, a page at a time: sort, search, filter by role and status.', access: ['admin'], query: userListQuery, answers: '200 json: Page<UserDto>', handler: users.list },
  { method: 'post', path: '/api/users', summary: 'Add a person with a temporary password they must change at first sign-in.', access: ['admin'], body: createUserBody, answers: '201 json: UserDto', handler: users.create },
  { method: 'post', path: '/api/users/invitations', summary: 'Invite a person by mail; they set their own password through a 72-hour link.', access: ['admin'], body: inviteBody, answers: '201 json: UserDto', handler: users.invite },
  { method: 'get', path: '/api/users/:id', summary: 'One person.', access: ['admin'], params: idParams, answers: '200 json: UserDto', handler: users.getOne },
  { method: 'patch', path: '/api/users/:id', summary: 'Change a person\'s name, e-mail, roles or machines (never one\'s own roles).', access: ['admin'], params: idParams, body: updateUserBody, answers: '200 json: UserDto', handler: users.update },
  { method: 'post', path: '/api/users/:id/deactivate', summary: 'Stop a person from signing in; their sessions end.', access: ['admin'], params: idParams, answers: '200 json: UserDto', handler: users.deactivate },
  { method: 'post', path: '/api/users/:id/reactivate', summary: 'Let a deactivated person sign in again.', access: ['admin'], params: idParams, answers: '200 json: UserDto', handler: users.reactivate },
  { method: 'post', path: '/api/users/:id/temporary-password', summary: 'Set a temporary password the person must change at next sign-in.', access: ['admin'], params: idParams, body: temporaryPasswordBody, answers: '200 json: UserDto', handler: users.setTemporaryPassword },
  { method: 'post', path: '/api/users/:id/invitation', summary: 'Send an invitation again; the older link stops working.', access: ['admin'], params: idParams, answers: '200 json: MessageDto', handler: users.resendInvitation },

  // Stock: everyone signed in reads; authors and admins edit. DELETE archives a referenced record.
  { method: 'get', path: '/api/materials', summary: 'Materials, a page at a time.', access: 'signedIn', query: stockListQuery, answers: '200 json: Page<MaterialRecord>', handler: materials.list },
  { method: 'post', path: '/api/materials', summary: 'Add a material.', access: STOCK_EDITORS, body: materialBody, answers: '201 json: MaterialRecord', handler: materials.create },
  { method: 'get', path: '/api/materials/:id', summary: 'One material.', access: 'signedIn', params: idParams, answers: '200 json: MaterialRecord', handler: materials.getOne },
  { method: 'put', path: '/api/materials/:id', summary: 'Change a material.', access: STOCK_EDITORS, params: idParams, body: materialBody, answers: '200 json: MaterialRecord', handler: materials.update },
  { method: 'post', path: '/api/materials/:id/archive', summary: 'Archive a material (kept for the recipes that use it, no longer offered).', access: STOCK_EDITORS, params: idParams, answers: '200 json: MaterialRecord', handler: materials.archive },
  { method: 'post', path: '/api/materials/:id/unarchive', summary: 'Offer an archived material again.', access: STOCK_EDITORS, params: idParams, answers: '200 json: MaterialRecord', handler: materials.unarchive },
  { method: 'delete', path: '/api/materials/:id', summary: 'Delete a material, or archive it when a recipe refers to it.', access: STOCK_EDITORS, params: idParams, answers: '200 json: { archived } — true when it was archived instead', handler: materials.remove },

  { method: 'get', path: '/api/wheels', summary: 'Wheels, a page at a time.', access: 'signedIn', query: stockListQuery, answers: '200 json: Page<WheelRecord>', handler: wheels.list },
  { method: 'post', path: '/api/wheels', summary: 'Add a wheel.', access: STOCK_EDITORS, body: wheelBody, answers: '201 json: WheelRecord', handler: wheels.create },
  { method: 'get', path: '/api/wheels/:id', summary: 'One wheel.', access: 'signedIn', params: idParams, answers: '200 json: WheelRecord', handler: wheels.getOne },
  { method: 'put', path: '/api/wheels/:id', summary: 'Change a wheel.', access: STOCK_EDITORS, params: idParams, body: wheelBody, answers: '200 json: WheelRecord', handler: wheels.update },
  { method: 'post', path: '/api/wheels/:id/archive', summary: 'Archive a wheel (kept for the recipes that use it, no longer offered).', access: STOCK_EDITORS, params: idParams, answers: '200 json: WheelRecord', handler: wheels.archive },
  { method: 'post', path: '/api/wheels/:id/unarchive', summary: 'Offer an archived wheel again.', access: STOCK_EDITORS, params: idParams, answers: '200 json: WheelRecord', handler: wheels.unarchive },
  { method: 'delete', path: '/api/wheels/:id', summary: 'Delete a wheel, or archive it when a recipe refers to it.', access: STOCK_EDITORS, params: idParams, answers: '200 json: { archived } — true when it was archived instead', handler: wheels.remove },

  { method: 'get', path: '/api/stock/speed-mismatches', summary: 'Machines that can turn a wheel of the lab above its marked maximum speed: their top speed, or the limit set on their spindle, against the marking at the wheel\'s new diameter (in-use records; wheels the machine takes).', access: 'signedIn', answers: '200 json: SpeedMismatch[]', handler: speedMismatches.list },
  { method: 'get', path: '/api/machines', summary: 'Machines, a page at a time.', access: 'signedIn', query: stockListQuery, answers: '200 json: Page<MachineRecord>', handler: machines.list },
  { method: 'post', path: '/api/machines', summary: 'Add a machine.', access: STOCK_EDITORS, body: machineBody, answers: '201 json: MachineRecord', handler: machines.create },
  { method: 'get', path: '/api/machines/:id', summary: 'One machine.', access: 'signedIn', params: idParams, answers: '200 json: MachineRecord', handler: machines.getOne },
  { method: 'put', path: '/api/machines/:id', summary: 'Change a machine.', access: STOCK_EDITORS, params: idParams, body: machineBody, answers: '200 json: MachineRecord', handler: machines.update },
  { method: 'post', path: '/api/machines/:id/archive', summary: 'Archive a machine (kept for the recipes that use it, no longer offered).', access: STOCK_EDITORS, params: idParams, answers: '200 json: MachineRecord', handler: machines.archive },
  { method: 'post', path: '/api/machines/:id/unarchive', summary: 'Offer an archived machine again.', access: STOCK_EDITORS, params: idParams, answers: '200 json: MachineRecord', handler: machines.unarchive },
  { method: 'delete', path: '/api/machines/:id', summary: 'Delete a machine, or archive it when a recipe refers to it.', access: STOCK_EDITORS, params: idParams, answers: '200 json: { archived } — true when it was archived instead', handler: machines.remove },

  { method: 'get', path: '/api/selection-rows', summary: 'The lab\'s wheel-selection table: material group and hardness band to wheel.', access: 'signedIn', answers: '200 json: SelectionRow[]', handler: selectionRows.list },
  { method: 'post', path: '/api/selection-rows', summary: 'Add a row to the wheel-selection table.', access: STOCK_EDITORS, body: selectionRowBody, answers: '201 json: SelectionRow', handler: selectionRows.create },
  { method: 'put', path: '/api/selection-rows/:id', summary: 'Change a row of the wheel-selection table.', access: STOCK_EDITORS, params: idParams, body: selectionRowBody, answers: '200 json: SelectionRow', handler: selectionRows.update },
  { method: 'delete', path: '/api/selection-rows/:id', summary: 'Remove a row of the wheel-selection table.', access: STOCK_EDITORS, params: idParams, answers: '204', handler: selectionRows.remove },

  { method: 'get', path: '/api/settings/limits', summary: 'The lab\'s limits the checks use: plunge-feed ceilings by material group, hardness band and machine class; traverse removal ceilings per mm of wheel width; the long-contact length; the worn wheel\'s default share of the new diameter and the kerf allowance; specific cutting energy per material group and the motor power share that warns.', access: 'signedIn', answers: '200 json: LabLimits', handler: settings.limits },
  { method: 'get', path: '/api/settings/lab', summary: 'The lab\'s settings: name, bench sheet paper, review interval, default units, date format and every limit the checks use, with the revision to send back when saving.', access: 'signedIn', answers: '200 json: LabSettingsDto', handler: settings.lab },
  { method: 'put', path: '/api/settings/lab', summary: 'Change the lab\'s settings (all values at once); a save based on an older revision gets 409 with the current settings. Each change is written to the trail with its values before and after.', access: ['admin'], body: labSettingsBody, answers: '200 json: LabSettingsDto', handler: settings.updateLab },

  // Recipes and drafts. Only authors write; the server hands out numbers and runs the checks.
  { method: 'get', path: '/api/recipes', summary: 'The library: recipes a page at a time, sorted and filtered (operators see approved versions only).', access: 'signedIn', query: recipeListQuery, answers: '200 json: Page<RecipeSummary>', handler: recipes.list },
  { method: 'post', path: '/api/recipes', summary: 'Start a recipe: it gets its number and a draft version 1.', access: ['author'], body: createRecipeBody, answers: '201 json: RecipeVersionDto', handler: recipes.create },
  { method: 'get', path: '/api/recipes/:id/versions', summary: 'The versions of a recipe the caller may see.', access: 'signedIn', params: idParams, answers: '200 json: RecipeVersionDto[]', handler: recipes.versions },
  { method: 'get', path: '/api/recipes/:id/versions/:n', summary: 'One version: content, computed values, checks, workflow, photos.', access: 'signedIn', params: versionParams, answers: '200 json: RecipeVersionDto', handler: recipes.getVersion },
  { method: 'put', path: '/api/recipes/:id/versions/:n', summary: 'Save a draft; a save based on an older revision gets 409 with the current content.', access: ['author'], params: versionParams, body: saveDraftBody, answers: '200 json: RecipeVersionDto', handler: recipes.saveDraft },
  { method: 'get', path: '/api/recipes/:id/compare', summary: 'Compare two versions: changed parameters with units, and a word-level diff of the texts.', access: 'signedIn', params: idParams, query: compareQuery, answers: '200 json: RecipeComparison', handler: compare.versions },
  // Review and approval: one transaction per transition, each checked against the revision seen.
  { method: 'post', path: '/api/recipes/:id/versions', summary: 'A new draft from an approved version, with the reason for the change.', access: ['author'], params: idParams, body: newVersionBody, answers: '201 json: RecipeVersionDto', handler: workflow.newVersion },
  { method: 'post', path: '/api/recipes/:id/versions/:n/submit', summary: 'Send a draft for review (refused while a check blocks it).', access: ['author'], params: versionParams, body: submitBody, answers: '200 json: RecipeVersionDto', handler: workflow.submit },
  { method: 'post', path: '/api/recipes/:id/versions/:n/return', summary: 'Return a version in review to its authors with a comment.', access: ['approver'], params: versionParams, body: returnBody, answers: '200 json: RecipeVersionDto', handler: workflow.returnToAuthor },
  { method: 'post', path: '/api/recipes/:id/versions/:n/approve', summary: 'Approve with an electronic signature (password again, meaning "approved"); never one\'s own version. Wrong signature passwords are limited per person (5 in 15 minutes, then 429).', access: ['approver'], params: versionParams, body: approveBody, answers: '200 json: RecipeVersionDto', handler: workflow.approve },
  { method: 'post', path: '/api/recipes/:id/versions/:n/withdraw', summary: 'Withdraw an approved version from use, signed, with a reason.', access: ['approver'], params: versionParams, body: withdrawBody, answers: '200 json: RecipeVersionDto', handler: workflow.withdraw },
  { method: 'get', path: '/api/recipes/:id/versions/:n/comments', summary: 'The review comments on a version.', access: 'signedIn', params: versionParams, answers: '200 json: ReviewCommentDto[]', handler: workflow.listComments },
  { method: 'post', path: '/api/recipes/:id/versions/:n/comments', summary: 'Comment on a version, on the whole or on one field.', access: ['author', 'approver'], params: versionParams, body: commentBody, answers: '201 json: ReviewCommentDto', handler: workflow.addComment },
  { method: 'post', path: '/api/recipes/:id/versions/:n/attachments', summary: 'Attach a photo (JPEG, PNG or WebP, at most 10 MB) to a draft; the bytes are checked and a thumbnail made.', access: ['author'], params: versionParams, body: attachmentFields, answers: '201 json: AttachmentDto', handler: attachments.upload, multipart: true },
  { method: 'delete', path: '/api/recipes/:id/versions/:n/attachments/:attachmentId', summary: 'Remove a photo from a draft.', access: ['author'], params: versionAttachmentParams, answers: '204', handler: attachments.remove },
  // "Read and understood": operators of the version's machine acknowledge; others see who has not.
  { method: 'post', path: '/api/recipes/:id/versions/:n/acknowledge', summary: 'Acknowledge a new current version of a recipe for one\'s machine ("read and understood"); send {}.', access: ['operator'], params: versionParams, answers: '200 json: MyAcknowledgementDto', handler: acknowledgements.acknowledge },
  { method: 'get', path: '/api/recipes/:id/versions/:n/changes-since-acknowledged', summary: 'For the operator acknowledging a version: what changed since the version of the recipe they last acknowledged (null when none).', access: ['operator'], params: versionParams, answers: '200 json: ChangesSinceAcknowledgedDto', handler: acknowledgements.changesSince },
  { method: 'get', path: '/api/recipes/:id/versions/:n/acknowledgements', summary: 'Who has acknowledged a version and who has not yet.', access: ['author', 'approver', 'auditor', 'admin'], params: versionParams, answers: '200 json: AcknowledgementsDto', handler: acknowledgements.list },
  // The bench sheet of an approved version (current or approved for a later day); every print is recorded.
  { method: 'get', path: '/api/recipes/:id/versions/:n/sheet.pdf', summary: 'The bench sheet of an approved version, with its check code and QR code; every print is recorded.', access: 'signedIn', params: versionParams, answers: '200 pdf: the bench sheet', handler: benchSheet.sheet },
  // Cut records: operators log cuts on the current version; everyone signed in reads them.
  { method: 'post', path: '/api/recipes/:id/versions/:n/cuts', summary: 'Record a cut made with the current version; any outcome but "good" flags the recipe for its authors.', access: ['operator'], params: versionParams, body: cutRecordBody, answers: '201 json: CutRecordDto', handler: cuts.record },
  { method: 'get', path: '/api/recipes/:id/versions/:n/cuts.csv', summary: 'The cuts made with a version, as a CSV file.', access: 'signedIn', params: versionParams, answers: '200 csv: one line per cut', handler: cuts.csv },
  { method: 'get', path: '/api/recipes/:id/versions/:n/cuts', summary: 'The cuts made with a version.', access: 'signedIn', params: versionParams, answers: '200 json: CutRecordDto[]', handler: cuts.listOfVersion },

  // The operator station: the finder, and cuts by specimen (traceability); authors clear flags.
  { method: 'get', path: '/api/finder', summary: 'Approved recipes that cover what is in hand (material, hardness, shape, size, machine), best matches first.', access: 'signedIn', query: finderQuery, answers: '200 json: FinderHit[]', handler: finder.find },
  { method: 'get', path: '/api/cuts', summary: 'Trace a specimen: the cuts recorded under its id, with the version and parameters used.', access: 'signedIn', query: cutSearchQuery, answers: '200 json: CutTrace[]', handler: cuts.search },
  { method: 'post', path: '/api/cuts/:cutId/clear-flag', summary: 'Clear the flag a cut put on its recipe.', access: ['author'], params: cutParams, answers: '200 json: CutRecordDto', handler: cuts.clearFlag },

  // The stored photos (image and thumbnail).
  { method: 'get', path: '/api/attachments/:id', summary: 'A stored photo as uploaded (ETag; answers 304 to If-None-Match).', access: 'signedIn', params: idParams, answers: ['200 image: the photo', '304'], handler: attachments.image },
  { method: 'get', path: '/api/attachments/:id/thumbnail', summary: 'The thumbnail of a stored photo (ETag; answers 304 to If-None-Match).', access: 'signedIn', params: idParams, answers: ['200 image: the thumbnail', '304'], handler: attachments.thumbnail },

  // The trail (auditors and admins read it; nobody writes it through the API).
  { method: 'get', path: '/api/trail', summary: 'The trail, newest first, filtered by recipe, person, type, family of events and days (sign-ins can be left out), each event naming its record; a page at a time by event id.', access: ['auditor', 'admin'], query: trailQuery, answers: '200 json: TrailPage', handler: trail.list },
  { method: 'get', path: '/api/trail.csv', summary: 'The filtered trail as a CSV file.', access: ['auditor', 'admin'], query: trailQuery, answers: '200 csv: one line per event', handler: trail.csv },
  { method: 'get', path: '/api/trail/verify', summary: 'Recompute the trail\'s hash chain and name the first broken link, if any.', access: ['auditor', 'admin'], answers: '200 json: ChainVerification', handler: trail.verify },
  { method: 'get', path: '/api/trail/people', summary: 'Everyone the trail can name (id, name, active), for filtering it by person.', access: ['auditor', 'admin'], answers: '200 json: { items: PersonNameDto[] }', handler: trail.people },
  { method: 'get', path: '/api/dev/outbox', summary: 'The mail outbox, newest first (development only: 404 in production).', access: ['admin'], answers: '200 json: { items: OutboxEntryDto[] }', handler: devOutbox.list },

  // What waits for people: periodic reviews coming due, and the signed-in person's Today lists.
  { method: 'get', path: '/api/reviews/due', summary: 'Approved recipes whose periodic review is coming due.', access: 'signedIn', answers: '200 json: ReviewDueSummary[]', handler: workflow.reviewsDue },
  { method: 'get', path: '/api/today', summary: 'The signed-in person\'s lists for today, by role.', access: 'signedIn', answers: '200 json: TodayDto', handler: today.today },

  // Is a printed sheet still the one to use? (the code and QR code on every bench sheet)
  { method: 'get', path: '/api/check/:code', summary: 'Whether the bench sheet with this check code is still the one to use, and which is.', access: 'signedIn', params: checkCodeParams, answers: '200 json: CheckCodeResult', handler: checkCodes.check },
] as const satisfies readonly RouteDefinition[];

/** Fails to compile, naming the path, when a line does not declare what its handler reads. */
const everyLineDeclaresItsInput: [UndeclaredInput<(typeof table)[number]>] extends [never] ? true : UndeclaredInput<(typeof table)[number]> = true;
void everyLineDeclaresItsInput;

export const routes: readonly RouteDefinition[] = table;
