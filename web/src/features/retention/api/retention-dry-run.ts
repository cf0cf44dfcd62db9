/** GET /api/admin/retention/dry-run — what the retention run would erase and delete now (administrators). */
import { useQuery } from '@tanstack/react-query'
import { retentionRunResponseSchema } from '@shared/schemas/retention'
import { api } from '@/lib/api-client'
import { retentionKeys } from '@/lib/query-keys'

export const useRetentionDryRun = (enabled: boolean) =>
  useQuery({
    queryKey: retentionKeys.dryRun(),
    queryFn: ({ signal }) => api.read(retentionRunResponseSchema, '/api/admin/retention/dry-run', signal).then((r) => r.run),
    enabled,
  })
