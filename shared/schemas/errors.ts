/** The one error body every API error uses. */
export interface ApiErrorBody {
  error: {
    /** Stable snake_case code, e.g. 'invalid_credentials', 'case_not_found'. */
    code: string
    message: string
    /** Field errors for validation failures: { path: 'email', message: '…' }[]. */
    details?: { path: string; message: string }[]
    requestId: string
  }
}
