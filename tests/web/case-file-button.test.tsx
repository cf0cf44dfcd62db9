/**
 * "Case file (PDF)" on the case page: shown from the case's abilities only; a click fetches the
 * signed file, saves it under the server's file name, shows the SHA-256 the timeline records
 * and reloads the case (whose timeline gains the entry); a refusal is shown in words.
 */
import { fireEvent, screen, waitFor } from '@testing-library/react'
import { HttpResponse } from 'msw'
import { afterEach, describe, expect, it, vi } from 'vitest'
import { useCase } from '@/features/case-page/api/get-case'
import { CaseFileButton } from '@/features/case-page/components/case-file-button'
import { paths } from '@/lib/paths'
import { answer, apiError } from '../support/msw-server'
import { abilities, caseResponse, IDS } from '../support/msw-views'
import { renderPage } from '../support/web-render'

const SHA = 'ab'.repeat(32)

function serve(can: Parameters<typeof abilities>) {
  return answer('get', '/api/cases/:id', caseResponse({ status: 'closed', abilities: abilities(...can) }))
}

/** The button as the case page places it, with the page's own case query (the rest of the page has its own tests). */
function CaseTop() {
  const q = useCase(IDS.case)
  if (!q.data) return <p>Loading</p>
  return (
    <>
      <h1>{q.data.reference}</h1>
      <CaseFileButton detail={q.data} />
    </>
  )
}

const openCase = () => renderPage({ url: `/cases/${IDS.case}`, routes: [{ path: paths.case.path, Component: CaseTop }] })

afterEach(() => vi.restoreAllMocks())

describe('the case file button', () => {
  it('is not shown without the ability', async () => {
    serve(['addInternalNote'])
    openCase()
    await screen.findByRole('heading', { level: 1 })
    expect(screen.queryByRole('button', { name: 'Case file (PDF)' })).not.toBeInTheDocument()
  })

  it('saves the signed file under the server’s name, shows its SHA-256 and reloads the case', async () => {
    const caseReads = serve(['issueCaseFile'])
    const asked = answer('get', '/api/cases/:id/case-file', () =>
      HttpResponse.arrayBuffer(new TextEncoder().encode('%PDF-1.7 test').buffer as ArrayBuffer, {
        headers: { 'Content-Type': 'application/pdf', 'Content-Disposition': 'attachment; filename="QB-26-000412-CF1.pdf"', 'X-Case-File-Sha256': SHA },
      }),
    )
    const created: Blob[] = []
    URL.createObjectURL = vi.fn((b: Blob) => {
      created.push(b)
      return 'blob:case-file'
    })
    URL.revokeObjectURL = vi.fn()
    const saved: string[] = []
    vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      saved.push(this.download)
    })
    openCase()
    fireEvent.click(await screen.findByRole('button', { name: 'Case file (PDF)' }))
    expect(await screen.findByText(/Saved QB-26-000412-CF1\.pdf/)).toHaveTextContent(SHA)
    expect(asked).toHaveLength(1)
    expect(saved).toEqual(['QB-26-000412-CF1.pdf'])
    expect(created[0]!.size).toBe('%PDF-1.7 test'.length)
    await waitFor(() => expect(caseReads.length).toBeGreaterThanOrEqual(2))
  })

  it('says why when the server refuses', async () => {
    serve(['issueCaseFile'])
    answer('get', '/api/cases/:id/case-file', () => apiError(503, { code: 'case_file_signing_unavailable', message: 'Case files cannot be signed: no signing certificate is configured (CASE_FILE_P12_PATH).' }))
    openCase()
    fireEvent.click(await screen.findByRole('button', { name: 'Case file (PDF)' }))
    expect(await screen.findByText(/Case files cannot be signed/)).toBeInTheDocument()
  })
})
