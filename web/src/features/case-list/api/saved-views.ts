/** GET/POST /api/me/saved-views, DELETE /api/me/saved-views/:id — the person's own saved list views. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query'
import { savedViewsResponseSchema, type SavedViewInput, type SavedViewView } from '@shared/schemas/saved-views'
import { api, apiRequest } from '@/lib/api-client'
import { meKeys } from '@/lib/query-keys'

export const useSavedViews = () => useQuery({ queryKey: meKeys.savedViews(), queryFn: ({ signal }) => api.read(savedViewsResponseSchema, '/api/me/saved-views', signal).then((r) => r.views) })

export function useSaveView() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (input: SavedViewInput) => api.post<{ view: SavedViewView }>('/api/me/saved-views', input).then((r) => r.view),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meKeys.savedViews() }),
  })
}

export function useRemoveView() {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: (id: string) => apiRequest<void>({ method: 'DELETE', path: `/api/me/saved-views/${encodeURIComponent(id)}` }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meKeys.savedViews() }),
  })
}
