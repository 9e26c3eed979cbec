import { Router } from 'express';
import { allow } from '../../http/access';
import { appOrigin } from '../../http/app-origin';
import { parse, parseId } from '../../http/validate';
import { answerQueryRequest, queryMessageRequest, queryStateRequest, raiseQueryRequest, transitionRequest } from '../../contracts/review';
import { db } from '../../../db/client';
import { loadAssignmentFor } from '../assignments/assignment-access';
import { listTimeline } from './review.repo';
import * as queries from './queries.service';
import { reviewQueue } from './review-queue.service';
import { transition } from './workflow.service';
import type { OkResponse, TransitionResponse } from '../../contracts/review';

export const reviewRouter = Router();

reviewRouter.post('/assignments/:id/transitions', allow('appraiser', 'reviewer'), async (req, res) => {
  const id = parseId(req.params);
  res.json((await transition(req.auth!.user, id, parse(transitionRequest, req.body), appOrigin(req))) satisfies TransitionResponse);
});

reviewRouter.get('/assignments/:id/timeline', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  const id = parseId(req.params);
  await loadAssignmentFor(db, req.auth!.user, id);
  res.json({ changes: await listTimeline(db, id) });
});

reviewRouter.get('/assignments/:id/queries', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  res.json({ queries: await queries.queriesOf(req.auth!.user, parseId(req.params)) });
});

reviewRouter.post('/assignments/:id/queries', allow('reviewer'), async (req, res) => {
  const id = parseId(req.params);
  res.status(201).json({ query: await queries.raiseQuery(req.auth!.user, id, parse(raiseQueryRequest, req.body), appOrigin(req)) });
});

reviewRouter.post('/queries/:id/messages', allow('appraiser', 'reviewer'), async (req, res) => {
  await queries.addMessage(req.auth!.user, parseId(req.params), parse(queryMessageRequest, req.body).body);
  res.status(201).json({ ok: true } satisfies OkResponse);
});

reviewRouter.post('/queries/:id/answer', allow('appraiser'), async (req, res) => {
  await queries.answerQuery(req.auth!.user, parseId(req.params), parse(answerQueryRequest, req.body), appOrigin(req));
  res.json({ ok: true } satisfies OkResponse);
});

reviewRouter.post('/queries/:id/resolve', allow('reviewer'), async (req, res) => {
  const body = parse(queryStateRequest, req.body);
  await queries.resolveOrReopen(req.auth!.user, parseId(req.params), 'resolved', body.version, body.body);
  res.json({ ok: true } satisfies OkResponse);
});

reviewRouter.post('/queries/:id/reopen', allow('reviewer'), async (req, res) => {
  const body = parse(queryStateRequest, req.body);
  await queries.resolveOrReopen(req.auth!.user, parseId(req.params), 'open', body.version, body.body);
  res.json({ ok: true } satisfies OkResponse);
});

reviewRouter.get('/review-queue', allow('reviewer', 'admin'), async (req, res) => {
  res.json({ items: await reviewQueue(req.auth!.user) });
});
