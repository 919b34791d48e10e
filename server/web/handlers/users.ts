import type { idParams } from '../../../shared/schemas/params';
import type { createUserBody, inviteBody, temporaryPasswordBody, updateUserBody, userListQuery } from '../../../shared/schemas/users';
import * as people from '../../services/people/users';
import type { RouteHandler } from '../route-definition';
import { actorOf } from './request-actor';

type WithId = { params: typeof idParams };

export const list: RouteHandler<{ query: typeof userListQuery }> = async (_req, res, { db }, { query }) => {
  res.json(await people.listUsers(db, query));
};

export const getOne: RouteHandler<WithId> = async (_req, res, { db }, { params }) => {
  res.json(await people.getUser(db, params.id));
};

export const create: RouteHandler<{ body: typeof createUserBody }> = async (req, res, { db }, { body }) => {
  res.status(201).json(await people.createUser(db, actorOf(req), body));
};

export const update: RouteHandler<WithId & { body: typeof updateUserBody }> = async (req, res, { db }, { params, body }) => {
  res.json(await people.updateUser(db, actorOf(req), params.id, body));
};

export const deactivate: RouteHandler<WithId> = async (req, res, { db }, { params }) => {
  res.json(await people.deactivateUser(db, actorOf(req), params.id));
};

export const reactivate: RouteHandler<WithId> = async (req, res, { db }, { params }) => {
  res.json(await people.reactivateUser(db, actorOf(req), params.id));
};

export const setTemporaryPassword: RouteHandler<WithId & { body: typeof temporaryPasswordBody }> = async (req, res, { db }, { params, body }) => {
  res.json(await people.setTemporaryPassword(db, actorOf(req), params.id, body.password));
};

/** POST /api/users/invitations — the person gets a mail with a 72 h link to set their password. */
export const invite: RouteHandler<{ body: typeof inviteBody }> = async (req, res, { db, mail }, { body }) => {
  res.status(201).json(await people.inviteUser(db, actorOf(req), mail, body));
};

/** POST /api/users/:id/invitation — a new link; the older one stops working. */
export const resendInvitation: RouteHandler<WithId> = async (req, res, { db, mail }, { params }) => {
  res.json(await people.resendInvitation(db, actorOf(req), mail, params.id));
};
