import type { Access } from '@shared/roles';

/** One entry of the side navigation. Shown only to users whose roles meet `access`. */
export interface NavItem {
  label: string;
  /** Ligature name in the Material Icons font. */
  icon: string;
  /** Absolute router path. */
  path: string;
  /** Should match the access of the route it opens (app.routes.ts or the feature's own route table); the route spec checks it. */
  access: Access;
  /** Shown only when the server keeps a development outbox (SessionDto.devOutbox). */
  devOnly?: true;
}

/** Add an entry here when its screen exists, never before. */
export const NAV_ITEMS: readonly NavItem[] = [
  // First: at the saw the finder is where the work starts; anyone signed in may use it, like its route.
  { label: 'Finder', icon: 'manage_search', path: '/finder', access: 'signedIn' },
  { label: 'Today', icon: 'today', path: '/today', access: 'signedIn' },
  { label: 'Library', icon: 'menu_book', path: '/library', access: 'signedIn' },
  { label: 'Stock', icon: 'inventory_2', path: '/stock', access: 'signedIn' },
  { label: 'Specimen trace', icon: 'biotech', path: '/cuts', access: 'signedIn' },
  { label: 'Trail', icon: 'policy', path: '/trail', access: ['auditor', 'admin'] },
  { label: 'People', icon: 'group', path: '/people', access: ['admin'] },
  { label: 'Lab settings', icon: 'tune', path: '/lab-settings', access: ['admin'] },
  { label: 'Outbox', icon: 'outgoing_mail', path: '/outbox', access: ['admin'], devOnly: true },
  { label: 'API reference', icon: 'api', path: '/api-reference', access: ['admin'] },
  { label: 'My account', icon: 'manage_accounts', path: '/account', access: 'signedIn' },
];
