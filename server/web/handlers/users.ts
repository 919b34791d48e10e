import { createUserBody, inviteBody, temporaryPasswordBody, updateUserBody, userListQuery } from '../../../shared/schemas/users';
import * as people from '../../services/people/users';
import type { RouteHandler } from '../route-definition';
import { bodyOf, idOf, parse } from './parse';
import { actorOf } from './request-actor';

export const list: RouteHandler = async (req, res, { db }) => {
  res.json(await people.listUsers(db, parse(userListQuery, req.query)));
};

export const getOne: RouteHandler = async (req, res, { db }) => {
  res.json(await people.getUser(db, idOf(req.params)));
};

export const create: RouteHandler = async (req, res, { db }) => {
  const body = parse(createUserBody, bodyOf(req.body));
  res.status(201).json(await people.createUser(db, actorOf(req), body));
};

export const update: RouteHandler = async (req, res, { db }) => {
  const id = idOf(req.params);
  const body = parse(updateUserBody, bodyOf(req.body));
  res.json(await people.updateUser(db, actorOf(req), id, body));
};

export const deactivate: RouteHandler = async (req, res, { db }) => {
  res.json(await people.deactivateUser(db, actorOf(req), idOf(req.params)));
};

export const reactivate: RouteHandler = async (req, res, { db }) => {
  res.json(await people.reactivateUser(db, actorOf(req), idOf(req.params)));
};

export const setTemporaryPassword: RouteHandler = async (req, res, { db }) => {
  const id = idOf(req.params);
  const body = parse(temporaryPasswordBody, bodyOf(req.body));
  res.json(await people.setTemporaryPassword(db, actorOf(req), id, body.password));
};

/** POST /api/users/invitations — the person gets a mail with a 72 h link to set their password. */
export const invite: RouteHandler = async (req, res, { db, mail }) => {
  const body = parse(inviteBody, bodyOf(req.body));
  res.status(201).json(await people.inviteUser(db, actorOf(req), mail, body));
};

/** POST /api/users/:id/invitation — a new link; the older one stops working. */
export const resendInvitation: RouteHandler = async (req, res, { db, mail }) => {
  res.json(await people.resendInvitation(db, actorOf(req), mail, idOf(req.params)));
};
