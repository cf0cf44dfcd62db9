/** The API reference: the document loaded, then read; a plain message (and the download link) when it cannot be. */
import { Loading } from '@/components/ui/loading'
import { PageHeader } from '@/components/ui/page-header'
import { QueryError } from '@/components/ui/query-error'
import { API_DOCUMENT_URL, useApiDocument } from '../api/get-api-document'
import { ApiReferenceView } from './api-reference-view'

export function ApiReferencePage() {
  const apiDocument = useApiDocument()
  return (
    <div className="flex min-w-0 flex-col">
      <PageHeader
        kicker="For integrators"
        title="API reference"
        lead={
          <p>
            What other systems — a national complaints portal, a monitoring network — can ask Quietband, and what it answers. Read from the API’s own
            description, so it matches the server you are looking at.
          </p>
        }
      />
      {apiDocument.isPending ? (
        <Loading label="Loading the API description…" />
      ) : apiDocument.isError ? (
        <div className="flex max-w-3xl flex-col gap-3">
          <QueryError error={apiDocument.error} what="the API description" onRetry={() => void apiDocument.refetch()} />
          <p>
            The reference is built from the document at <a href={API_DOCUMENT_URL}>{API_DOCUMENT_URL}</a>; you can try to open it directly.
          </p>
        </div>
      ) : (
        <ApiReferenceView document={apiDocument.data} />
      )}
    </div>
  )
}
