// TanStack Query hooks for what a viewer link opens and for a sheet's pins, reached as a member or through a link:
// the pins kept live by the server's event stream, and the changes (new pin, reply, resolve, attachment) that
// refresh them. A guest's name is given through better-auth's anonymous sign-in.
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { pinsPath, type PinCreateBody, type PinPlace } from './api-client';
import { auth } from './auth-client';
import { getApiClient, queryKeys } from './queries';

export const pinKeys = {
  pins: (place: PinPlace) => ['pins', pinsPath(place)] as const,
  viewLink: (token: string) => ['view-link', token] as const,
};

/** The link's sheet and who is asking; a revoked or expired link is a 410, which is final. */
export function useViewLink(token: string | undefined) {
  return useQuery({
    queryKey: pinKeys.viewLink(token ?? ''),
    queryFn: () => getApiClient().getViewLink(token!),
    enabled: !!token,
    retry: false,
  });
}

export function usePins(place: PinPlace | null) {
  return useQuery({
    queryKey: place ? pinKeys.pins(place) : ['pins', 'none'],
    queryFn: async () => (await getApiClient().listPins(place!)).pins,
    enabled: !!place,
    retry: (count, error) => count < 2 && (error as { status?: number }).status !== 410,
  });
}

/** Follows the sheet's pin events while mounted; each event refreshes the pins. */
export function usePinEvents(place: PinPlace | null) {
  const client = useQueryClient();
  const path = place ? pinsPath(place) : null;
  useEffect(() => {
    if (!place || typeof EventSource === 'undefined') return;
    const source = new EventSource(getApiClient().pinEventsUrl(place), { withCredentials: true });
    const refresh = () => void client.invalidateQueries({ queryKey: pinKeys.pins(place) });
    source.addEventListener('pins', refresh);
    // After a dropped stream the browser reconnects by itself; what was missed meanwhile is read again.
    source.addEventListener('open', refresh);
    return () => source.close();
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [path, client]);
}

function useRefreshPins(place: PinPlace) {
  const client = useQueryClient();
  return () => client.invalidateQueries({ queryKey: pinKeys.pins(place) });
}

export function useAddPin(place: PinPlace) {
  const refresh = useRefreshPins(place);
  return useMutation({ mutationFn: async (body: PinCreateBody) => (await getApiClient().addPin(place, body)).pin, onSuccess: refresh });
}

export function useReplyToPin(place: PinPlace) {
  const refresh = useRefreshPins(place);
  return useMutation({
    mutationFn: async ({ pinId, body }: { pinId: string; body: string }) => (await getApiClient().replyToPin(place, pinId, body)).pin,
    onSuccess: refresh,
  });
}

export function useResolvePin(place: PinPlace) {
  const refresh = useRefreshPins(place);
  return useMutation({
    mutationFn: async ({ pinId, resolved }: { pinId: string; resolved: boolean }) => (await getApiClient().resolvePin(place, pinId, resolved)).pin,
    onSuccess: refresh,
  });
}

export function useAttachToPin(place: PinPlace) {
  const refresh = useRefreshPins(place);
  return useMutation({
    mutationFn: async ({ pinId, file, fileName }: { pinId: string; file: Blob; fileName: string }) =>
      (await getApiClient().attachToPin(place, pinId, file, fileName)).attachment,
    onSuccess: refresh,
  });
}

/** Gives a visitor a guest session under the name they typed; the link's answer then says who they are. */
export function useGuestSignIn(token: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => auth.signInAsGuest(name),
    onSuccess: () =>
      Promise.all([
        client.invalidateQueries({ queryKey: pinKeys.viewLink(token) }),
        client.invalidateQueries({ queryKey: queryKeys.session }),
      ]),
  });
}
