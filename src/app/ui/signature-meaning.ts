import type { SignatureMeaning } from '@shared/schemas/workflow';

/** What each signature means, in the words shown beside it and in the signing dialog (21 CFR 11.50). */
export const SIGNATURE_MEANING_INFO: Record<SignatureMeaning, { label: string; statement: string; icon: string }> = {
  approved: { label: 'Approved', statement: 'I have reviewed this version and approve it for use', icon: 'verified' },
  withdrawn: { label: 'Withdrawn', statement: 'this version must no longer be used', icon: 'block' },
};
