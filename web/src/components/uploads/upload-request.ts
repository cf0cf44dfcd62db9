/**
 * One file upload with progress: XMLHttpRequest, because fetch reports no upload progress.
 * Same origin, so the session cookie goes along; a failure becomes the app's ApiError from the
 * server's error body (toApiError), exactly as the API client does for fetch.
 */
import { ApiError, toApiError } from '@/lib/api-client'

export interface UploadProgress {
  sentBytes: number
  totalBytes: number
}

export interface UploadHandle<T> {
  /** Resolves with the parsed JSON answer; rejects with ApiError (or an AbortError after abort()). */
  done: Promise<T>
  abort: () => void
}

export class UploadAborted extends Error {
  constructor() {
    super('The upload was cancelled.')
    this.name = 'AbortError'
  }
}

const UNREACHABLE_MESSAGE = 'The Quietband server did not answer. Check your connection and try again.'

function parseBody(text: string): unknown {
  if (!text) return undefined
  try {
    return JSON.parse(text)
  } catch {
    return text
  }
}

/** POSTs `form` to `path` (a same-origin API path); `onProgress` is called as bytes leave. */
export function startUpload<T>(options: { path: string; form: FormData; onProgress?: (p: UploadProgress) => void }): UploadHandle<T> {
  const xhr = new XMLHttpRequest()
  const done = new Promise<T>((resolve, reject) => {
    xhr.open('POST', options.path)
    xhr.withCredentials = true
    xhr.setRequestHeader('Accept', 'application/json')
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) options.onProgress?.({ sentBytes: e.loaded, totalBytes: e.total })
    }
    xhr.onload = () => {
      const body = parseBody(xhr.responseText)
      if (xhr.status >= 200 && xhr.status < 300) resolve(body as T)
      else reject(toApiError({ status: xhr.status, body }))
    }
    xhr.onerror = () => reject(new ApiError({ status: 0, code: 'network_error', message: UNREACHABLE_MESSAGE }))
    xhr.onabort = () => reject(new UploadAborted())
    xhr.send(options.form)
  })
  return { done, abort: () => xhr.abort() }
}
