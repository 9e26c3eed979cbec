import { Router } from 'express';
import { allow } from '../../http/access';
import { appOrigin } from '../../http/app-origin';
import { parse, parseId } from '../../http/validate';
import { inviteRequest, updateUserRequest } from '../../contracts/users';
import { listOrganisations, listUsers } from './users.repo';
import { invite, updateUser } from './users.service';

export const usersRouter = Router();

usersRouter.get('/users', allow('admin'), async (_req, res) => {
  res.json({ users: await listUsers() });
});

usersRouter.post('/users/invitations', allow('admin'), async (req, res) => {
  const body = parse(inviteRequest, req.body);
  res.status(201).json(await invite(req.auth!.user, body, appOrigin(req)));
});

usersRouter.patch('/users/:id', allow('admin'), async (req, res) => {
  const id = parseId(req.params);
  res.json(await updateUser(req.auth!.user, id, parse(updateUserRequest, req.body)));
});

// Appraisers pick the client organisation of an assignment; admins invite into one.
usersRouter.get('/organisations', allow('admin', 'appraiser', 'reviewer'), async (_req, res) => {
  res.json({ organisations: await listOrganisations() });
});
