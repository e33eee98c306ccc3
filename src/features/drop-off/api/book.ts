import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { BookingCreate, BookingUpdate, BookingView } from '@shared/schemas/booking';

/**
 * A booking changes slots, the maker's blankets and their statuses at once, so every cached
 * answer is refetched rather than patched by hand.
 */
function useRefreshAll() {
  const qc = useQueryClient();
  return () => qc.invalidateQueries();
}

export const createBooking = (body: BookingCreate) => api.post<{ booking: BookingView }>('/api/bookings', body).then((r) => r.booking);
export function useCreateBooking() {
  const refresh = useRefreshAll();
  return useMutation({ mutationFn: createBooking, onSettled: refresh });
}

export const moveBooking = ({ id, ...body }: BookingUpdate & { id: number }) => api.patch<{ booking: BookingView }>(`/api/bookings/${id}`, body).then((r) => r.booking);
export function useMoveBooking() {
  const refresh = useRefreshAll();
  return useMutation({ mutationFn: moveBooking, onSettled: refresh });
}

export const cancelBooking = (id: number) => api.delete<{ booking: BookingView }>(`/api/bookings/${id}`).then((r) => r.booking);
export function useCancelBooking() {
  const refresh = useRefreshAll();
  return useMutation({ mutationFn: cancelBooking, onSettled: refresh });
}

/** An organiser marks that the maker did not come; the blankets are finished again, so all is refetched. */
export const markMissed = (id: number) => api.post<{ booking: BookingView }>(`/api/bookings/${id}/missed`, {}).then((r) => r.booking);
export function useMarkMissed() {
  const refresh = useRefreshAll();
  return useMutation({ mutationFn: markMissed, onSettled: refresh });
}
