/**
 * POST /api/evidence/:id/band — channel power and occupied bandwidth of a band, computed by the
 * server on the stored display trace. Frequencies go in hertz (the base unit).
 */
import { useMutation } from '@tanstack/react-query'
import type { EvidenceBandView } from '@shared/schemas/spectrum'
import { api } from '@/lib/api-client'

export const measureBand = (evidenceId: string, band: { lowFreqHz: number; highFreqHz: number }) =>
  api.post<{ band: EvidenceBandView }>(`/api/evidence/${encodeURIComponent(evidenceId)}/band`, band)

export const useMeasureBand = (evidenceId: string) => useMutation({ mutationFn: (band: { lowFreqHz: number; highFreqHz: number }) => measureBand(evidenceId, band) })
