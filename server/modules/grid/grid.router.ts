import { Router } from 'express';
import { z } from 'zod';
import { allow } from '../../http/access';
import { parse, parseId } from '../../http/validate';
import { firmSettingsUpdate, gridEntryUpdate, gridSettingsUpdate } from '../../contracts/grid';
import { getGrid } from './grid.service';
import * as edits from './grid-edits.service';

export const gridRouter = Router();

const saleParams = z.object({ id: z.coerce.number().int().positive().max(2_147_483_647), saleId: z.coerce.number().int().positive().max(2_147_483_647) });

gridRouter.get('/assignments/:id/grid', allow('appraiser', 'reviewer', 'admin'), async (req, res) => {
  res.json(await getGrid(req.auth!.user, parseId(req.params)));
});

gridRouter.put('/assignments/:id/grid/settings', allow('appraiser'), async (req, res) => {
  const id = parseId(req.params);
  await edits.updateGridSettings(req.auth!.user, id, parse(gridSettingsUpdate, req.body));
  res.json(await getGrid(req.auth!.user, id));
});

gridRouter.put('/assignments/:id/grid/sales/:saleId', allow('appraiser'), async (req, res) => {
  const { id, saleId } = parse(saleParams, req.params);
  await edits.updateGridEntry(req.auth!.user, id, saleId, parse(gridEntryUpdate, req.body));
  res.json(await getGrid(req.auth!.user, id));
});

gridRouter.get('/firm-settings', allow('admin', 'appraiser', 'reviewer'), async (req, res) => {
  res.json(await edits.getFirmSettings(req.auth!.user));
});

gridRouter.put('/firm-settings', allow('admin'), async (req, res) => {
  res.json(await edits.updateFirmSettings(req.auth!.user, parse(firmSettingsUpdate, req.body)));
});
