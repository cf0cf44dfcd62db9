/**
 * GET /api/cases/:id/case-file — a new signed case file (PDF). Each call issues a new numbered
 * file and records its SHA-256 on the timeline, so the case page is refreshed afterwards.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query'
import { ApiError, toApiError } from '@/lib/api-client'
import { caseKeys } from '@/lib/query-keys'

export interface IssuedCaseFile {
  blob: Blob
  fileName: string
  sha256: string | null
}

export const caseFilePath = (caseId: string) => `/api/cases/${encodeURIComponent(caseId)}/case-file`

export async function issueCaseFile(caseId: string): Promise<IssuedCaseFile> {
  let response: Response
  try {
    response = await fetch(caseFilePath(caseId), { credentials: 'same-origin', headers: { Accept: 'application/pdf, application/json' } })
  } catch {
    throw new ApiError({ status: 0, code: 'network_error', message: 'The Quietband server did not answer. Check your connection and try again.' })
  }
  if (!response.ok) {
    const text = await response.text()
    let body: unknown = text
    try {
      body = JSON.parse(text)
    } catch {
      // not JSON: toApiError makes a plain message of it
    }
    throw toApiError({ status: response.status, body })
  }
  const name = /filename="([^"]+)"/.exec(response.headers.get('Content-Disposition') ?? '')?.[1] ?? 'case-file.pdf'
  return { blob: await response.blob(), fileName: name, sha256: response.headers.get('X-Case-File-Sha256') }
}

/** Saves a blob under a name through the browser's download. */
export function saveBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob)
  const a = document.createElement('a')
  a.href = url
  a.download = fileName
  document.body.append(a)
  a.click()
  a.remove()
  setTimeout(() => URL.revokeObjectURL(url), 30_000)
}

export function useIssueCaseFile(caseId: string) {
  const queryClient = useQueryClient()
  return useMutation({
    mutationFn: () => issueCaseFile(caseId),
    onSuccess: (file) => {
      saveBlob(file.blob, file.fileName)
      void queryClient.invalidateQueries({ queryKey: caseKeys.detail(caseId) })
    },
  })
}
