/**
 * The demo people of the invented lab: one per role. `npm start` prints these from here,
 * so the list and the database never disagree. Demo only: a real install creates its
 * first admin with `npm run admin:create` and never loads seeds.
 */
import type { Role } from '../../shared/roles';

export interface DemoAccount {
  username: string;
  password: string;
  displayName: string;
  email: string;
  roles: Role[];
  /** Saws the person runs (operators): they acknowledge new versions for these. */
  machines?: string[];
}

export const DEMO_LAB_NAME = 'Harrowgate Forge — Materials Lab (demo)';

export const DEMO_ACCOUNTS: DemoAccount[] = [
  { username: 'ines.author', password: 'demo-author-2026', displayName: 'Ines Varga', email: 'ines.varga@harrowgate.example', roles: ['author'] },
  { username: 'tomas.approver', password: 'demo-approver-2026', displayName: 'Tomas Brandt', email: 'tomas.brandt@harrowgate.example', roles: ['approver'] },
  {
    username: 'kofi.operator',
    password: 'demo-operator-2026',
    displayName: 'Kofi Mensah',
    email: 'kofi.mensah@harrowgate.example',
    roles: ['operator'],
    machines: ['Bay 1 floor saw', 'Bay 2 bench saw'],
  },
  { username: 'ruth.auditor', password: 'demo-auditor-2026', displayName: 'Ruth Okafor', email: 'ruth.okafor@harrowgate.example', roles: ['auditor'] },
  { username: 'leon.admin', password: 'demo-admin-2026', displayName: 'Leon Achterberg', email: 'leon.achterberg@harrowgate.example', roles: ['admin'] },
];
