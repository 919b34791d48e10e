import type { UserDto } from '@shared/api-types';
import type { AcknowledgementsDto, MyAcknowledgementDto, RecipeVersionDto } from '@shared/recipe-types';
import { aRecipeVersion } from './stock-and-recipe-fixtures';
import { aUser } from './user-fixture';

/** Invented operators, versions and acknowledgements for the acknowledgement specs; override what the test is about. */

/** An operator who runs machine 1 (Bench saw B2 in the stock fixtures). */
export function anOperator(overrides: Partial<UserDto> = {}): UserDto {
  return aUser({ id: 12, username: 'kmensah', displayName: 'Kofi Mensah', email: 'kofi@lab.example', roles: ['operator'], machineIds: [1], ...overrides });
}

export function myAcknowledgement(overrides: Partial<MyAcknowledgementDto> = {}): MyAcknowledgementDto {
  return { required: true, acknowledgedAt: null, ...overrides };
}

/** Version 2 of KB-0003, approved and current, with a change reason; still to acknowledge unless overridden. */
export function aVersionToAcknowledge(overrides: Partial<RecipeVersionDto> = {}): RecipeVersionDto {
  const base = aRecipeVersion({ version: 2, status: 'approved' });
  return {
    ...base,
    content: { ...base.content, changeReason: 'Slower feed for the harder batch.', cautionsMd: 'Keep the guard closed.' },
    workflow: {
      signatures: [],
      effectiveFrom: '2026-11-30',
      reviewDueOn: '2028-11-30',
      submittedAt: '2026-11-25T08:00:00.000Z',
      supersededAt: null,
      withdrawnAt: null,
      withdrawnReason: null,
      editorIds: [7],
    },
    myAcknowledgement: myAcknowledgement(),
    ...overrides,
  };
}

export function anAcknowledgements(overrides: Partial<AcknowledgementsDto> = {}): AcknowledgementsDto {
  return {
    recipeId: 3,
    version: 2,
    machine: { id: 1, name: 'Bench saw B2' },
    acknowledged: [{ userId: 12, displayName: 'Kofi Mensah', acknowledgedAt: '2026-12-01T09:15:00.000Z' }],
    pending: [
      { userId: 14, displayName: 'Ines Duarte' },
      { userId: 15, displayName: 'Piet de Vries' },
    ],
    ...overrides,
  };
}
