// Invitations: the key factory and query options for the head coach's list, the roster entries an
// invitation can link, and the preview behind an e-mailed link.
import { queryOptions } from '@tanstack/react-query';
import type {
  Invitation,
  InvitationPreview,
  LinkableAthlete,
  ListInvitationsQuery,
  ListResponse,
} from '../../../../shared/schemas';
import { api } from '../../../lib/api-client';

export const invitationKeys = {
  all: ['invitations'] as const,
  lists: () => [...invitationKeys.all, 'list'] as const,
  list: (filters: ListInvitationsQuery) => [...invitationKeys.lists(), filters] as const,
  linkable: () => [...invitationKeys.all, 'linkable-athletes'] as const,
  preview: (token: string) => [...invitationKeys.all, 'preview', token] as const,
};

export const invitationsQueryOptions = (filters: ListInvitationsQuery = { status: 'open', limit: 100 }) =>
  queryOptions({
    queryKey: invitationKeys.list(filters),
    queryFn: ({ signal }) => {
      const q = new URLSearchParams(
        Object.entries(filters)
          .filter(([, v]) => v !== undefined)
          .map(([k, v]) => [k, String(v)]),
      );
      return api<ListResponse<Invitation>>(`/invitations?${q}`, { signal });
    },
  });

export const linkableAthletesQueryOptions = () =>
  queryOptions({
    queryKey: invitationKeys.linkable(),
    queryFn: ({ signal }) => api<ListResponse<LinkableAthlete>>('/invitations/linkable-athletes', { signal }),
  });

export const invitationPreviewQueryOptions = (token: string) =>
  queryOptions({
    queryKey: invitationKeys.preview(token),
    queryFn: ({ signal }) =>
      api<InvitationPreview>(`/invitation-links/preview?token=${encodeURIComponent(token)}`, { signal }),
    retry: false,
    staleTime: Infinity,
  });
