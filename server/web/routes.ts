/**
 * Every API route, one line each: method, path, who may call it, handler. The router and
 * the role-walk test are both built from this table. Within a path, specific routes come
 * before parameterised ones.
 */
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
import * as passwordLinks from './handlers/password-links';
import * as recipes from './handlers/recipes';
import * as selectionRows from './handlers/selection-rows';
import * as session from './handlers/session';
import * as settings from './handlers/settings';
import { machines, materials, wheels } from './handlers/stock';
import * as today from './handlers/today';
import * as trail from './handlers/trail';
import * as users from './handlers/users';
import * as workflow from './handlers/workflow';
import type { RouteDefinition } from './route-definition';

/** Who edits stock: authors, and admins who keep the lab's lists. */
const STOCK_EDITORS = ['author', 'admin'] as const;

export const routes: readonly RouteDefinition[] = [
  { method: 'get', path: '/api/health', access: 'public', handler: health.check },

  // Session: the routes someone with a temporary password can still use.
  { method: 'get', path: '/api/session/csrf', access: 'public', handler: session.issueCsrfToken, whilePasswordChangeRequired: true },
  { method: 'get', path: '/api/session', access: 'signedIn', handler: session.current, whilePasswordChangeRequired: true },
  { method: 'post', path: '/api/session', access: 'public', handler: session.signIn, whilePasswordChangeRequired: true },
  { method: 'delete', path: '/api/session', access: 'signedIn', handler: session.signOut, whilePasswordChangeRequired: true },
  { method: 'post', path: '/api/session/password', access: 'signedIn', handler: session.changePassword, whilePasswordChangeRequired: true },
  { method: 'patch', path: '/api/session/preferences', access: 'signedIn', handler: session.updatePreferences },
  { method: 'get', path: '/api/session/notifications', access: 'signedIn', handler: notifications.get },
  { method: 'patch', path: '/api/session/notifications', access: 'signedIn', handler: notifications.update },

  // Single-use links from mails (invitation 72 h, password reset 1 h). "Forgot" answers the same for any address.
  { method: 'post', path: '/api/password/forgot', access: 'public', handler: passwordLinks.forgot },
  { method: 'post', path: '/api/password/link', access: 'public', handler: passwordLinks.inspect },
  { method: 'post', path: '/api/password/set', access: 'public', handler: passwordLinks.set },

  // People (admin).
  { method: 'get', path: '/api/users', access: ['admin'], handler: users.list },
  { method: 'post', path: '/api/users', access: ['admin'], handler: users.create },
  { method: 'post', path: '/api/users/invitations', access: ['admin'], handler: users.invite },
  { method: 'get', path: '/api/users/:id', access: ['admin'], handler: users.getOne },
  { method: 'patch', path: '/api/users/:id', access: ['admin'], handler: users.update },
  { method: 'post', path: '/api/users/:id/deactivate', access: ['admin'], handler: users.deactivate },
  { method: 'post', path: '/api/users/:id/reactivate', access: ['admin'], handler: users.reactivate },
  { method: 'post', path: '/api/users/:id/temporary-password', access: ['admin'], handler: users.setTemporaryPassword },
  { method: 'post', path: '/api/users/:id/invitation', access: ['admin'], handler: users.resendInvitation },

  // Stock: everyone signed in reads; authors and admins edit. DELETE archives a referenced record.
  { method: 'get', path: '/api/materials', access: 'signedIn', handler: materials.list },
  { method: 'post', path: '/api/materials', access: STOCK_EDITORS, handler: materials.create },
  { method: 'get', path: '/api/materials/:id', access: 'signedIn', handler: materials.getOne },
  { method: 'put', path: '/api/materials/:id', access: STOCK_EDITORS, handler: materials.update },
  { method: 'post', path: '/api/materials/:id/archive', access: STOCK_EDITORS, handler: materials.archive },
  { method: 'post', path: '/api/materials/:id/unarchive', access: STOCK_EDITORS, handler: materials.unarchive },
  { method: 'delete', path: '/api/materials/:id', access: STOCK_EDITORS, handler: materials.remove },

  { method: 'get', path: '/api/wheels', access: 'signedIn', handler: wheels.list },
  { method: 'post', path: '/api/wheels', access: STOCK_EDITORS, handler: wheels.create },
  { method: 'get', path: '/api/wheels/:id', access: 'signedIn', handler: wheels.getOne },
  { method: 'put', path: '/api/wheels/:id', access: STOCK_EDITORS, handler: wheels.update },
  { method: 'post', path: '/api/wheels/:id/archive', access: STOCK_EDITORS, handler: wheels.archive },
  { method: 'post', path: '/api/wheels/:id/unarchive', access: STOCK_EDITORS, handler: wheels.unarchive },
  { method: 'delete', path: '/api/wheels/:id', access: STOCK_EDITORS, handler: wheels.remove },

  { method: 'get', path: '/api/machines', access: 'signedIn', handler: machines.list },
  { method: 'post', path: '/api/machines', access: STOCK_EDITORS, handler: machines.create },
  { method: 'get', path: '/api/machines/:id', access: 'signedIn', handler: machines.getOne },
  { method: 'put', path: '/api/machines/:id', access: STOCK_EDITORS, handler: machines.update },
  { method: 'post', path: '/api/machines/:id/archive', access: STOCK_EDITORS, handler: machines.archive },
  { method: 'post', path: '/api/machines/:id/unarchive', access: STOCK_EDITORS, handler: machines.unarchive },
  { method: 'delete', path: '/api/machines/:id', access: STOCK_EDITORS, handler: machines.remove },

  { method: 'get', path: '/api/selection-rows', access: 'signedIn', handler: selectionRows.list },
  { method: 'post', path: '/api/selection-rows', access: STOCK_EDITORS, handler: selectionRows.create },
  { method: 'put', path: '/api/selection-rows/:id', access: STOCK_EDITORS, handler: selectionRows.update },
  { method: 'delete', path: '/api/selection-rows/:id', access: STOCK_EDITORS, handler: selectionRows.remove },

  { method: 'get', path: '/api/settings/limits', access: 'signedIn', handler: settings.limits },

  // Recipes and drafts. Only authors write; the server hands out numbers and runs the checks.
  { method: 'get', path: '/api/recipes', access: 'signedIn', handler: recipes.list },
  { method: 'post', path: '/api/recipes', access: ['author'], handler: recipes.create },
  { method: 'get', path: '/api/recipes/:id/versions', access: 'signedIn', handler: recipes.versions },
  { method: 'get', path: '/api/recipes/:id/versions/:n', access: 'signedIn', handler: recipes.getVersion },
  { method: 'put', path: '/api/recipes/:id/versions/:n', access: ['author'], handler: recipes.saveDraft },
  { method: 'get', path: '/api/recipes/:id/compare', access: 'signedIn', handler: compare.versions },
  // Review and approval: one transaction per transition, each checked against the revision seen.
  { method: 'post', path: '/api/recipes/:id/versions', access: ['author'], handler: workflow.newVersion },
  { method: 'post', path: '/api/recipes/:id/versions/:n/submit', access: ['author'], handler: workflow.submit },
  { method: 'post', path: '/api/recipes/:id/versions/:n/return', access: ['approver'], handler: workflow.returnToAuthor },
  { method: 'post', path: '/api/recipes/:id/versions/:n/approve', access: ['approver'], handler: workflow.approve },
  { method: 'post', path: '/api/recipes/:id/versions/:n/withdraw', access: ['approver'], handler: workflow.withdraw },
  { method: 'get', path: '/api/recipes/:id/versions/:n/comments', access: 'signedIn', handler: workflow.listComments },
  { method: 'post', path: '/api/recipes/:id/versions/:n/comments', access: ['author', 'approver'], handler: workflow.addComment },
  { method: 'post', path: '/api/recipes/:id/versions/:n/attachments', access: ['author'], handler: attachments.upload, multipart: true },
  { method: 'delete', path: '/api/recipes/:id/versions/:n/attachments/:attachmentId', access: ['author'], handler: attachments.remove },
  // "Read and understood": operators of the version's machine acknowledge; others see who has not.
  { method: 'post', path: '/api/recipes/:id/versions/:n/acknowledge', access: ['operator'], handler: acknowledgements.acknowledge },
  { method: 'get', path: '/api/recipes/:id/versions/:n/acknowledgements', access: ['author', 'approver', 'auditor', 'admin'], handler: acknowledgements.list },
  // The bench sheet of an approved version (current or approved for a later day); every print is recorded.
  { method: 'get', path: '/api/recipes/:id/versions/:n/sheet.pdf', access: 'signedIn', handler: benchSheet.sheet },
  // Cut records: operators log cuts on the current version; everyone signed in reads them.
  { method: 'post', path: '/api/recipes/:id/versions/:n/cuts', access: ['operator'], handler: cuts.record },
  { method: 'get', path: '/api/recipes/:id/versions/:n/cuts.csv', access: 'signedIn', handler: cuts.csv },
  { method: 'get', path: '/api/recipes/:id/versions/:n/cuts', access: 'signedIn', handler: cuts.listOfVersion },

  // The operator station: the finder, and cuts by specimen (traceability); authors clear flags.
  { method: 'get', path: '/api/finder', access: 'signedIn', handler: finder.find },
  { method: 'get', path: '/api/cuts', access: 'signedIn', handler: cuts.search },
  { method: 'post', path: '/api/cuts/:cutId/clear-flag', access: ['author'], handler: cuts.clearFlag },

  // The stored photos (image and thumbnail).
  { method: 'get', path: '/api/attachments/:id', access: 'signedIn', handler: attachments.image },
  { method: 'get', path: '/api/attachments/:id/thumbnail', access: 'signedIn', handler: attachments.thumbnail },

  // The trail (auditors and admins read it; nobody writes it through the API).
  { method: 'get', path: '/api/trail', access: ['auditor', 'admin'], handler: trail.list },
  { method: 'get', path: '/api/trail.csv', access: ['auditor', 'admin'], handler: trail.csv },
  { method: 'get', path: '/api/trail/verify', access: ['auditor', 'admin'], handler: trail.verify },
  { method: 'get', path: '/api/dev/outbox', access: ['admin'], handler: devOutbox.list },

  // What waits for people: periodic reviews coming due, and the signed-in person's Today lists.
  { method: 'get', path: '/api/reviews/due', access: 'signedIn', handler: workflow.reviewsDue },
  { method: 'get', path: '/api/today', access: 'signedIn', handler: today.today },

  // Is a printed sheet still the one to use? (the code and QR code on every bench sheet)
  { method: 'get', path: '/api/check/:code', access: 'signedIn', handler: checkCodes.check },
];
