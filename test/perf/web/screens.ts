/** The screens `npm run bench:web` measures, and whom each is opened as. */
import { DEMO_ACCOUNTS, type DemoAccount } from '../../../seeds/data/demo-accounts';

export interface Screen {
  name: string;
  path: string;
  /** The demo person signed in, or null for a signed-out visit. */
  person: DemoAccount | null;
}

function demo(username: string): DemoAccount {
  const account = DEMO_ACCOUNTS.find((a) => a.username === username);
  if (!account) throw new Error(`No demo account ${username} in seeds/data/demo-accounts.ts.`);
  return account;
}

/** In this order the browser signs in once per person: signed out, then the author, then the operator. */
export function benchScreens(approvedRecipeId: number): Screen[] {
  const author = demo('ines.author');
  const operator = demo('kofi.operator');
  return [
    { name: 'Sign-in', path: '/sign-in', person: null },
    { name: 'Today', path: '/today', person: author },
    { name: 'Library', path: '/library', person: author },
    { name: 'Recipe', path: `/recipes/${approvedRecipeId}`, person: author },
    { name: 'Editor', path: '/recipes/new', person: author },
    { name: 'Finder', path: '/finder', person: operator },
  ];
}
