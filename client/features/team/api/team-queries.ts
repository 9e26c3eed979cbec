import { queryOptions } from '@tanstack/react-query';
import { z } from 'zod';
import { inviteRequest, organisationsResponse, teamResponse, updateUserRequest } from '@contracts/users';
import { roleSchema } from '@contracts/auth';
import { apiRequest } from '../../../lib/api-client';

/** Answers of POST /api/users/invitations (201) and PATCH /api/users/:id. Not yet in @contracts/users. */
const invitationCreated = z.object({ id: z.number().int() });
const memberUpdated = z.object({ id: z.number().int(), active: z.boolean(), role: roleSchema, version: z.number().int() });

/** Query keys and fetchers of the team feature, general → specific: ['team'] clears them all. */
export const teamQueries = {
  all: () => ['team'] as const,
  members: () =>
    queryOptions({
      queryKey: [...teamQueries.all(), 'members'] as const,
      queryFn: ({ signal }) => apiRequest('/api/users', teamResponse, { signal }),
      select: (data) => data.users,
    }),
  organisations: () =>
    queryOptions({
      queryKey: [...teamQueries.all(), 'organisations'] as const,
      queryFn: ({ signal }) => apiRequest('/api/organisations', organisationsResponse, { signal }),
      select: (data) => data.organisations,
      staleTime: 5 * 60_000,
    }),
};

export type InviteInput = z.input<typeof inviteRequest>;
export type MemberUpdate = z.input<typeof updateUserRequest>;

export const teamRequests = {
  invite: (body: InviteInput) => apiRequest('/api/users/invitations', invitationCreated, { method: 'POST', body }),
  update: (id: number, body: MemberUpdate) => apiRequest(`/api/users/${id}`, memberUpdated, { method: 'PATCH', body }),
};
