import type { idParams, versionParams } from '../../../shared/schemas/params';
import type { approveBody, commentBody, newVersionBody, returnBody, submitBody, withdrawBody } from '../../../shared/schemas/workflow';
import { versionScopeOf } from '../../services/operator/visibility';
import * as comments from '../../services/recipes/review-comments';
import { listReviewsDue } from '../../services/operator/today';
import * as workflow from '../../services/recipes/workflow';
import { sealAfterApproval } from '../../services/trail/seals';
import type { RouteHandler } from '../route-definition';
import { actorOf, rememberFullSigning } from './request-actor';

type OnVersion = { params: typeof versionParams };

export const submit: RouteHandler<OnVersion & { body: typeof submitBody }> = async (req, res, { db, mail }, { params: { id, n }, body }) => {
  res.json(await workflow.submitVersion(db, actorOf(req), id, n, body, new Date(), mail));
};

export const returnToAuthor: RouteHandler<OnVersion & { body: typeof returnBody }> = async (req, res, { db, mail }, { params: { id, n }, body }) => {
  res.json(await workflow.returnVersion(db, actorOf(req), id, n, body, new Date(), mail));
};

export const approve: RouteHandler<OnVersion & { body: typeof approveBody }> = async (req, res, { db, mail, seals }, { params: { id, n }, body }) => {
  const signed = await workflow.approveVersion(db, actorOf(req), id, n, body, new Date(), mail);
  rememberFullSigning(req);
  // After the approval's transaction has committed: the seal covers the approval's event.
  await sealAfterApproval(db, seals);
  res.json(signed);
};

export const withdraw: RouteHandler<OnVersion & { body: typeof withdrawBody }> = async (req, res, { db, mail }, { params: { id, n }, body }) => {
  const signed = await workflow.withdrawVersion(db, actorOf(req), id, n, body, new Date(), mail);
  rememberFullSigning(req);
  res.json(signed);
};

export const newVersion: RouteHandler<{ params: typeof idParams; body: typeof newVersionBody }> = async (req, res, { db }, { params, body }) => {
  res.status(201).json(await workflow.createNextVersion(db, actorOf(req), params.id, body));
};

export const listComments: RouteHandler<OnVersion> = async (req, res, { db }, { params: { id, n } }) => {
  res.json(await comments.listComments(db, id, n, versionScopeOf(req.user?.roles)));
};

export const addComment: RouteHandler<OnVersion & { body: typeof commentBody }> = async (req, res, { db }, { params: { id, n }, body }) => {
  res.status(201).json(await comments.addComment(db, actorOf(req), id, n, body));
};

export const reviewsDue: RouteHandler = async (_req, res, { db }) => {
  res.json(await listReviewsDue(db));
};
