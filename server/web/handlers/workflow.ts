import { z } from 'zod';
import { idParam } from '../../../shared/schemas/fields';
import { approveBody, commentBody, newVersionBody, returnBody, submitBody, withdrawBody } from '../../../shared/schemas/workflow';
import { versionScopeOf } from '../../services/operator/visibility';
import * as comments from '../../services/recipes/review-comments';
import { listReviewsDue } from '../../services/operator/today';
import * as workflow from '../../services/recipes/workflow';
import type { RouteHandler } from '../route-definition';
import { bodyOf, idOf, parse } from './parse';
import { actorOf } from './request-actor';

const versionParams = z.object({ id: idParam, n: idParam });

export const submit: RouteHandler = async (req, res, { db, mail }) => {
  const { id, n } = parse(versionParams, req.params);
  res.json(await workflow.submitVersion(db, actorOf(req), id, n, parse(submitBody, bodyOf(req.body)), new Date(), mail));
};

export const returnToAuthor: RouteHandler = async (req, res, { db, mail }) => {
  const { id, n } = parse(versionParams, req.params);
  res.json(await workflow.returnVersion(db, actorOf(req), id, n, parse(returnBody, bodyOf(req.body)), new Date(), mail));
};

export const approve: RouteHandler = async (req, res, { db, mail }) => {
  const { id, n } = parse(versionParams, req.params);
  res.json(await workflow.approveVersion(db, actorOf(req), id, n, parse(approveBody, bodyOf(req.body)), new Date(), mail));
};

export const withdraw: RouteHandler = async (req, res, { db }) => {
  const { id, n } = parse(versionParams, req.params);
  res.json(await workflow.withdrawVersion(db, actorOf(req), id, n, parse(withdrawBody, bodyOf(req.body))));
};

export const newVersion: RouteHandler = async (req, res, { db }) => {
  const id = idOf(req.params);
  res.status(201).json(await workflow.createNextVersion(db, actorOf(req), id, parse(newVersionBody, bodyOf(req.body))));
};

export const listComments: RouteHandler = async (req, res, { db }) => {
  const { id, n } = parse(versionParams, req.params);
  res.json(await comments.listComments(db, id, n, versionScopeOf(req.user?.roles)));
};

export const addComment: RouteHandler = async (req, res, { db }) => {
  const { id, n } = parse(versionParams, req.params);
  res.status(201).json(await comments.addComment(db, actorOf(req), id, n, parse(commentBody, bodyOf(req.body))));
};

export const reviewsDue: RouteHandler = async (_req, res, { db }) => {
  res.json(await listReviewsDue(db));
};
