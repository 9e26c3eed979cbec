import { Router } from 'express';
import { allow } from '../../http/access';
import { sendEncodedJson } from '../../http/encoded-json';
import { parseId } from '../../http/validate';
import { analysisResponse } from './analysis.service';

export const analysisRouter = Router();

// Sent from bytes encoded once per data revision, with an ETag: an unchanged analysis is a 304.
analysisRouter.get('/assignments/:id/analysis', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  sendEncodedJson(req, res, await analysisResponse(req.auth!.user, parseId(req.params)));
});
