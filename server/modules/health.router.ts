import { Router } from 'express';
import { pool } from '../../db/client';
import { anyone } from '../http/access';

export const healthRouter = Router();

healthRouter.get('/health', anyone, async (_req, res) => {
  try {
    await pool.query({ text: 'select 1', query_timeout: 2000 } as never);
    res.json({ status: 'ok', database: 'ok' });
  } catch {
    res.status(503).json({ status: 'degraded', database: 'unavailable' });
  }
});
