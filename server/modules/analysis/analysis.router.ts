import { Router } from 'express';
import { allow } from '../../http/access';
import { parseId } from '../../http/validate';
import { analysisJson } from './analysis.service';

export const analysisRouter = Router();

analysisRouter.get('/assignments/:id/analysis', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  const json = await analysisJson(req.auth!.user, parseId(req.params));
  res.type('application/json').send(json);
});
