import type { ClientErrorCode } from '../core/http/api-error';

/** The server's codes for a mail link that cannot be used. */
type LinkCode = Extract<ClientErrorCode, 'LINK_INVALID' | 'LINK_USED' | 'LINK_EXPIRED'>;

/** Why a mail link cannot be used, in words that say what to do next. */
export interface LinkProblem {
  code: LinkCode;
  title: string;
  explanation: string;
}

const PROBLEMS: Record<LinkCode, Omit<LinkProblem, 'code'>> = {
  LINK_INVALID: {
    title: 'This link does not work',
    explanation: 'It may be incomplete: copy the whole link from the mail into the address bar.',
  },
  LINK_USED: {
    title: 'This link has already been used',
    explanation: 'Each link works once. If you set your password with it, sign in with that password.',
  },
  LINK_EXPIRED: {
    title: 'This link has expired',
    explanation: 'Invitation links work for 72 hours, password-reset links for one hour.',
  },
};

/** The problem for a server error code, or null when the code is not about the link. */
export function linkProblem(code: ClientErrorCode): LinkProblem | null {
  return code === 'LINK_INVALID' || code === 'LINK_USED' || code === 'LINK_EXPIRED' ? { code, ...PROBLEMS[code] } : null;
}
