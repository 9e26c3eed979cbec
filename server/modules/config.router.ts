import { Router } from 'express';
import { env } from '../env';
import { anyone } from '../http/access';

export const configRouter = Router();

/** What the client needs to know about this installation: a self-hosted map style, when set. */
configRouter.get('/config', anyone, (_req, res) => {
  res.set('Cache-Control', 'public, max-age=300').json({ mapStyleUrl: env.MAP_STYLE_URL ?? null });
});
