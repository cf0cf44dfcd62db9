/**
 * The import's steps (administrators): upload the CSV (stored, then inspected), inspect again with
 * another delimiter, preview every row with a mapping, confirm into a new register version.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import type { CsvDelimiter } from '@shared/domain/station-register'
import { csvInspectionResponseSchema, importConfirmResponseSchema, importPreviewResponseSchema, type ColumnMapping } from '@shared/schemas/stations'
import { api } from '@/lib/api-client'
import { stationRegisterKeys } from '@/lib/query-keys'

const base = '/api/station-register/uploads'

export async function uploadRegister(options: { file: File; delimiter?: CsvDelimiter }) {
  const form = new FormData()
  if (options.delimiter) form.append('delimiter', options.delimiter)
  form.append('file', options.file)
  return csvInspectionResponseSchema.parse(await api.upload<unknown>(base, form)).inspection
}

export async function inspectUpload(options: { fileId: string; delimiter: CsvDelimiter }) {
  return csvInspectionResponseSchema.parse(await api.post<unknown>(`${base}/${encodeURIComponent(options.fileId)}/inspect`, { delimiter: options.delimiter })).inspection
}

export async function previewImport(options: { fileId: string; delimiter: CsvDelimiter; mapping: ColumnMapping }) {
  return importPreviewResponseSchema.parse(await api.post<unknown>(`${base}/${encodeURIComponent(options.fileId)}/preview`, { delimiter: options.delimiter, mapping: options.mapping })).report
}

export async function confirmImport(options: { fileId: string; delimiter: CsvDelimiter; mapping: ColumnMapping }) {
  return importConfirmResponseSchema.parse(await api.post<unknown>(`${base}/${encodeURIComponent(options.fileId)}/confirm`, { delimiter: options.delimiter, mapping: options.mapping }))
}

export const useUploadRegister = () => useMutation({ mutationFn: uploadRegister })
export const useInspectUpload = () => useMutation({ mutationFn: inspectUpload })
export const usePreviewImport = () => useMutation({ mutationFn: previewImport })

export function useConfirmImport() {
  const queryClient = useQueryClient()
  return useMutation({ mutationFn: confirmImport, onSuccess: () => queryClient.invalidateQueries({ queryKey: stationRegisterKeys.all }) })
}
