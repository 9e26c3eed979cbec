import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import {
  invitationAccept,
  invitationPreview,
  meResponse,
  passwordResetConfirm,
  passwordResetRequest,
  signInRequest,
  type SessionUser,
} from '@contracts/auth';
import { apiRequest } from '../../../lib/api-client';
import { isApiError } from '../../../lib/api-error';

/** The answer to POST /api/auth/password-reset (202). Not yet in @contracts/auth. */
const passwordResetAccepted = z.object({ message: z.string() });

/** GET /api/auth/me answers 401 when nobody is signed in: that is "no session", not a failure. */
async function fetchSessionUser({ signal }: { signal: AbortSignal }): Promise<SessionUser | null> {
  try {
    const { user } = await apiRequest('/api/auth/me', meResponse, { signal });
    return user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

/** Query keys and fetchers of the auth feature, general → specific: ['auth'] clears them all. */
export const authQueries = {
  all: () => ['auth'] as const,
  me: () =>
    queryOptions({
      queryKey: [...authQueries.all(), 'me'] as const,
      queryFn: fetchSessionUser,
      staleTime: 60_000,
    }),
  invitation: (token: string) =>
    queryOptions({
      queryKey: [...authQueries.all(), 'invitation', token] as const,
      queryFn: ({ signal }) => apiRequest(`/api/invitations/${encodeURIComponent(token)}`, invitationPreview, { signal }),
      staleTime: Infinity,
    }),
};

export type SignInInput = z.input<typeof signInRequest>;
export type PasswordResetRequestInput = z.input<typeof passwordResetRequest>;
export type PasswordResetConfirmInput = z.input<typeof passwordResetConfirm>;
export type InvitationAcceptInput = z.input<typeof invitationAccept>;

/** The auth feature's writes. Each answers 204 except the reset request, which returns a message. */
export const authRequests = {
  signIn: (body: SignInInput) => apiRequest('/api/auth/sign-in', null, { method: 'POST', body }),
  signOut: () => apiRequest('/api/auth/sign-out', null, { method: 'POST' }),
  requestPasswordReset: (body: PasswordResetRequestInput) =>
    apiRequest('/api/auth/password-reset', passwordResetAccepted, { method: 'POST', body }),
  confirmPasswordReset: (body: PasswordResetConfirmInput) =>
    apiRequest('/api/auth/password-reset/confirm', null, { method: 'POST', body }),
  acceptInvitation: (body: InvitationAcceptInput) => apiRequest('/api/invitations/accept', null, { method: 'POST', body }),
};
