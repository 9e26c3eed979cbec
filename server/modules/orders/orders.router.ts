import { Router } from 'express';
import { allow } from '../../http/access';
import { appOrigin } from '../../http/app-origin';
import { parse, parseId } from '../../http/validate';
import { acceptRequest, declineRequest, orderInput, payRequest } from '../../contracts/orders';
import { acceptOrder, declineOrder } from './order-decisions.service';
import { payOrder } from './order-payment.service';
import * as service from './orders.service';

/** Journey 1: a lender client orders and pays; the firm's admins and appraisers accept or decline.
 * Reviewers have no part in ordering. */
export const ordersRouter = Router();

ordersRouter.get('/fees', allow('client', 'appraiser', 'reviewer', 'admin'), async (req, res) => {
  res.json({ fees: await service.feesFor(req.auth!.user) });
});

ordersRouter.get('/orders', allow('client', 'appraiser', 'admin'), async (req, res) => {
  res.json({ orders: await service.listOrdersFor(req.auth!.user) });
});

ordersRouter.post('/orders', allow('client'), async (req, res) => {
  const input = parse(orderInput, req.body);
  res.status(201).json(await service.placeOrder(req.auth!.user, input, appOrigin(req)));
});

ordersRouter.get('/orders/:id', allow('client', 'appraiser', 'admin'), async (req, res) => {
  res.json(await service.getOrder(req.auth!.user, parseId(req.params)));
});

ordersRouter.post('/orders/:id/pay', allow('client'), async (req, res) => {
  const id = parseId(req.params);
  res.status(202).json(await payOrder(req.auth!.user, id, parse(payRequest, req.body)));
});

ordersRouter.post('/orders/:id/accept', allow('appraiser', 'admin'), async (req, res) => {
  const id = parseId(req.params);
  res.json(await acceptOrder(req.auth!.user, id, parse(acceptRequest, req.body), appOrigin(req)));
});

ordersRouter.post('/orders/:id/decline', allow('appraiser', 'admin'), async (req, res) => {
  const id = parseId(req.params);
  res.json(await declineOrder(req.auth!.user, id, parse(declineRequest, req.body), appOrigin(req)));
});
