/** GET /api/openapi.json — the API's OpenAPI 3.1 document, which the reference page reads. */
import { queryOptions, useQuery } from '@tanstack/react-query'
import { apiDocumentResponseSchema } from '@shared/schemas/service'
import { api, isApiError } from '@/lib/api-client'
import { shouldRetry } from '@/lib/query-client'
import { apiReferenceKeys } from '@/lib/query-keys'

/** Where the document is served (also the page's download link). */
export const API_DOCUMENT_URL = '/api/openapi.json'

export const getApiDocument = (signal?: AbortSignal) => api.read(apiDocumentResponseSchema, API_DOCUMENT_URL, signal)

export const apiDocumentQueryOptions = () =>
  queryOptions({
    queryKey: apiReferenceKeys.document(),
    queryFn: ({ signal }) => getApiDocument(signal),
    // the document changes only when the server is updated
    staleTime: 10 * 60_000,
    // an answer that is not an OpenAPI document will not become one on asking again
    retry: (failureCount, error) => !(isApiError(error) && error.code === 'unexpected_answer') && shouldRetry(failureCount, error),
  })

export const useApiDocument = () => useQuery(apiDocumentQueryOptions())
