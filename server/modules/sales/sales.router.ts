import { Router } from 'express';
import { z } from 'zod';
import { allow } from '../../http/access';
import { parse } from '../../http/validate';
import { saleCreate, saleUpdate } from '../../contracts/sales';
import * as service from './sales.service';
import { salesCsv } from './sales-export';

export const salesRouter = Router();

const ids = z.object({ id: z.coerce.number().int().positive().max(2_147_483_647), saleId: z.coerce.number().int().positive().max(2_147_483_647) });
const assignmentIdOnly = ids.pick({ id: true });

salesRouter.get('/assignments/:id/sales', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  const { id } = parse(assignmentIdOnly, req.params);
  res.json(await service.listAssignmentSales(req.auth!.user, id));
});

/** The sales as a spreadsheet file; formula-like text is neutralised (see sales-export.ts). */
salesRouter.get('/assignments/:id/sales.csv', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  const { id } = parse(assignmentIdOnly, req.params);
  const { sales } = await service.listAssignmentSales(req.auth!.user, id);
  res
    .set({ 'Content-Type': 'text/csv; charset=utf-8', 'Content-Disposition': `attachment; filename="compline-sales-${id}.csv"`, 'Cache-Control': 'private, no-store' })
    .send(salesCsv(sales));
});

salesRouter.post('/assignments/:id/sales', allow('appraiser'), async (req, res) => {
  const { id } = parse(assignmentIdOnly, req.params);
  res.status(201).json({ sale: await service.createSale(req.auth!.user, id, parse(saleCreate, req.body)) });
});

salesRouter.patch('/assignments/:id/sales/:saleId', allow('appraiser'), async (req, res) => {
  const { id, saleId } = parse(ids, req.params);
  res.json({ sale: await service.updateSale(req.auth!.user, id, saleId, parse(saleUpdate, req.body)) });
});

salesRouter.delete('/assignments/:id/sales/:saleId', allow('appraiser'), async (req, res) => {
  const { id, saleId } = parse(ids, req.params);
  const { version } = parse(z.object({ version: z.coerce.number().int().positive() }), req.query);
  await service.deleteSale(req.auth!.user, id, saleId, version);
  res.status(204).end();
});
