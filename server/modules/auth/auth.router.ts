import { Router } from 'express';
import { z } from 'zod';
import { lucia } from './lucia';
import { anyone, signedIn } from '../../http/access';
import { parse } from '../../http/validate';
import { appOrigin, clientIp } from '../../http/app-origin';
import { invitationAccept, passwordResetConfirm, passwordResetRequest, signInRequest } from '../../contracts/auth';
import * as auth from './auth.service';
import { writeSessionCookie } from './session.middleware';

export const authRouter = Router();

authRouter.post('/auth/sign-in', anyone, async (req, res) => {
  const body = parse(signInRequest, req.body);
  const previousSessionId = lucia.readSessionCookie(req.headers.cookie ?? '');
  const { cookie } = await auth.signIn({ ...body, ip: clientIp(req), previousSessionId });
  writeSessionCookie(req, res, cookie);
  res.status(204).end();
});

authRouter.post('/auth/sign-out', signedIn, async (req, res) => {
  writeSessionCookie(req, res, await auth.signOut(req.auth!.sessionId));
  res.status(204).end();
});

authRouter.get('/auth/me', signedIn, (req, res) => {
  res.json({ user: req.auth!.user });
});

authRouter.post('/auth/password-reset', anyone, async (req, res) => {
  const { email } = parse(passwordResetRequest, req.body);
  await auth.requestPasswordReset(email, clientIp(req), appOrigin(req));
  res.status(202).json({ message: 'If that address has an account, a reset link is on its way.' });
});

authRouter.post('/auth/password-reset/confirm', anyone, async (req, res) => {
  const body = parse(passwordResetConfirm, req.body);
  await auth.confirmPasswordReset(body.token, body.password);
  res.status(204).end();
});

authRouter.get('/invitations/:token', anyone, async (req, res) => {
  const { token } = parse(z.object({ token: z.string().min(20).max(200) }), req.params);
  res.json(await auth.previewInvitation(token));
});

authRouter.post('/invitations/accept', anyone, async (req, res) => {
  const body = parse(invitationAccept, req.body);
  writeSessionCookie(req, res, await auth.acceptInvitation(body.token, body.password));
  res.status(204).end();
});
