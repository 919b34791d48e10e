import { expect } from 'chai';
import { createUserBody, temporaryPasswordBody, updateUserBody, userListQuery } from '../../../../shared/schemas/users';
import { toFieldErrors } from '../../../../shared/validation';

function paths(result: { success: boolean; error?: unknown }): string[] {
  return result.success ? [] : toFieldErrors(result.error as never).map((e) => e.path);
}

describe('shared/schemas/users', () => {
  it('createUserBody: lower-cases the name, defaults the e-mail, checks roles', () => {
    const parsed = createUserBody.parse({ username: 'New.Person', displayName: 'N P', roles: ['author'], temporaryPassword: 'long-enough-1' });
    expect(parsed).to.include({ username: 'new.person', email: '' });
    expect(paths(createUserBody.safeParse({ username: 'np', displayName: 'N', roles: ['boss'], temporaryPassword: 'x' }))).to.have.members([
      'username',
      'roles.0',
      'temporaryPassword',
    ]);
    expect(
      paths(createUserBody.safeParse({ username: 'new.person', displayName: 'N', roles: ['admin', 'admin'], temporaryPassword: 'long-enough-1' })),
    ).to.deep.equal(['roles']);
  });

  it('updateUserBody: something must change; the username cannot', () => {
    expect(updateUserBody.safeParse({ roles: [] }).success).to.equal(true);
    expect(paths(updateUserBody.safeParse({}))).to.deep.equal(['']);
    expect(updateUserBody.safeParse({ username: 'renamed' }).success).to.equal(false);
  });

  it('temporaryPasswordBody: a valid new password', () => {
    expect(temporaryPasswordBody.safeParse({ password: 'long-enough-1' }).success).to.equal(true);
    expect(paths(temporaryPasswordBody.safeParse({ password: 'short' }))).to.deep.equal(['password']);
  });

  it('userListQuery: defaults, coercion from query text, limits', () => {
    expect(userListQuery.parse({})).to.deep.equal({ page: 0, pageSize: 25, sort: 'username', dir: 'asc', status: 'all' });
    expect(userListQuery.parse({ page: '2', pageSize: '10', q: '  steel ' })).to.include({ page: 2, pageSize: 10, q: 'steel' });
    for (const bad of [{ pageSize: '101' }, { page: '-1' }, { sort: 'password_hash' }, { role: 'boss' }, { q: 'x'.repeat(101) }, { other: '1' }]) {
      expect(userListQuery.safeParse(bad).success, JSON.stringify(bad)).to.equal(false);
    }
  });
});
