/** Everyone the trail can name, so an auditor filters by a person's name rather than an id. */
import type { Knex } from 'knex';
import type { PersonNameDto } from '../../../shared/recipe-types';
import { listPeopleNames } from '../../data/trail-subjects';

export async function listPeople(db: Knex): Promise<PersonNameDto[]> {
  return (await listPeopleNames(db)).map((p) => ({ id: p.id, displayName: p.display_name, active: Boolean(p.active) }));
}
