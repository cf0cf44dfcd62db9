/** GET /api/station-register/versions — every import of the register, newest first; and one version's report. */
import { useQuery } from '@tanstack/react-query'
import { registerVersionResponseSchema, registerVersionsResponseSchema, type RegisterVersionView } from '@shared/schemas/stations'
import { api } from '@/lib/api-client'
import { stationRegisterKeys } from '@/lib/query-keys'

export type RegisterVersion = RegisterVersionView

export const useRegisterVersions = () =>
  useQuery({ queryKey: stationRegisterKeys.versions(), queryFn: ({ signal }) => api.read(registerVersionsResponseSchema, '/api/station-register/versions', signal), staleTime: 60_000 })

export const useRegisterVersion = (version: number, enabled: boolean) =>
  useQuery({
    queryKey: stationRegisterKeys.version(version),
    queryFn: ({ signal }) => api.read(registerVersionResponseSchema, `/api/station-register/versions/${version}`, signal),
    enabled,
    staleTime: Infinity,
  })
