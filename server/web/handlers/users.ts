import { AppError } from '../../app-error';
import { createUserBody, temporaryPasswordBody, updateUserBody, userListQuery } from '../../../shared/schemas/users';
import * as people from '../../services/users';
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

// Contract stubs (issue 6): replaced by the real handlers.
export const invite: RouteHandler = () => {
  throw new AppError(501, 'NOT_BUILT', [{ path: '', message: 'Not built yet.' }]);
};
export const resendInvitation: RouteHandler = () => {
  throw new AppError(501, 'NOT_BUILT', [{ path: '', message: 'Not built yet.' }]);
};
