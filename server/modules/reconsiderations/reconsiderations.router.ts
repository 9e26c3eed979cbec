import { Router } from 'express';
import { allow } from '../../http/access';
import { appOrigin } from '../../http/app-origin';
import { parse, parseId } from '../../http/validate';
import { reconsiderationRequest, reconsiderationResponseRequest } from '../../contracts/reconsiderations';
import * as service from './reconsiderations.service';
import type { z } from 'zod';
import type { reconsiderationFiledResponse, ReconsiderationListResponse } from '../../contracts/reconsiderations';
import type { OkResponse } from '../../contracts/review';

export const reconsiderationsRouter = Router();

reconsiderationsRouter.post('/reports/:id/reconsiderations', allow('client'), async (req, res) => {
  const id = parseId(req.params);
  res.status(201).json((await service.fileReconsideration(req.auth!.user, id, parse(reconsiderationRequest, req.body), appOrigin(req))) satisfies z.infer<typeof reconsiderationFiledResponse>);
});

reconsiderationsRouter.get('/reports/:id/reconsiderations', allow('client', 'appraiser', 'reviewer', 'admin'), async (req, res) => {
  res.json({ reconsiderations: await service.listReconsiderations(req.auth!.user, { reportVersionId: parseId(req.params) }) } satisfies ReconsiderationListResponse);
});

reconsiderationsRouter.get('/assignments/:id/reconsiderations', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  res.json({ reconsiderations: await service.listReconsiderations(req.auth!.user, { assignmentId: parseId(req.params) }) } satisfies ReconsiderationListResponse);
});

reconsiderationsRouter.post('/reconsiderations/:id/respond', allow('appraiser'), async (req, res) => {
  const id = parseId(req.params);
  await service.respond(req.auth!.user, id, parse(reconsiderationResponseRequest, req.body), appOrigin(req));
  res.json({ ok: true } satisfies OkResponse);
});

