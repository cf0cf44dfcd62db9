/** /api-reference — the API for integrators, read from the API's own OpenAPI document (public). */
import { ApiReferencePage } from '@/features/api-reference/components/api-reference-page'

export function Component() {
  return <ApiReferencePage />
}
