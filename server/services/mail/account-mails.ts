/** The two account mails: an invitation (72 h link) and a password reset (1 h link). Never optional. */
import type { OutgoingMail } from './outbox';
import { composeMail } from './layout';
import type { MailSettings } from './settings';

/** The client page both links open; the token travels in the query. */
export function setPasswordPath(token: string): string {
  return `/set-password?token=${encodeURIComponent(token)}`;
}

export interface InvitationMailInput {
  to: string;
  displayName: string;
  username: string;
  labName: string;
  invitedBy: string;
  token: string;
}

export function invitationMail(settings: MailSettings, input: InvitationMailInput): OutgoingMail {
  return composeMail(settings.baseUrl, {
    to: input.to,
    subject: `You are invited to Kerfbook — ${input.labName}`,
    greeting: input.displayName,
    paragraphs: [
      `${input.invitedBy} invited you to Kerfbook, the cutting recipe library of ${input.labName}.`,
      `Your username is ${input.username}. Open the link below to choose your password; then sign in with your username and that password.`,
      'The link works once and expires in 72 hours. If it has expired, ask an admin of your lab to send a new invitation.',
    ],
    action: { label: 'Choose your password', path: setPasswordPath(input.token) },
    footer: ['If you did not expect this invitation, you can ignore this mail.'],
    kind: 'invitation',
  });
}

export interface ResetMailInput {
  to: string;
  displayName: string;
  username: string;
  labName: string;
  token: string;
}

export function passwordResetMail(settings: MailSettings, input: ResetMailInput): OutgoingMail {
  return composeMail(settings.baseUrl, {
    to: input.to,
    subject: `Set a new Kerfbook password — ${input.labName}`,
    greeting: input.displayName,
    paragraphs: [
      `Someone asked for a new password for the Kerfbook account ${input.username} at ${input.labName}.`,
      'Open the link below to choose a new password. The link works once and expires in one hour. Setting a new password signs the account out everywhere else.',
    ],
    action: { label: 'Choose a new password', path: setPasswordPath(input.token) },
    footer: ['If you did not ask for this, ignore this mail: your password stays as it is.'],
    kind: 'password-reset',
  });
}
