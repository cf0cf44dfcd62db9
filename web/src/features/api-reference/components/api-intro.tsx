/** What every caller needs before the operations: addresses, format, signing in, the one error shape, the document itself. */
import { Fragment } from 'react'
import { isObject, sessionCookieName } from '../lib/openapi'
import { API_DOCUMENT_URL } from '../api/get-api-document'
import { InlineText } from './inline-text'

const ERROR_EXAMPLE = `{
  "error": {
    "code": "validation_failed",
    "message": "Some fields need attention.",
    "details": [{ "path": "email", "message": "Enter an e-mail address." }],
    "requestId": "4b9e0c2a-…"
  }
}`

const ERROR_FIELDS: [string, string][] = [
  ['code', 'A stable snake_case word to act on, e.g. case_not_found, invalid_transition, stale_version, validation_failed. It does not change between versions.'],
  ['message', 'A sentence for people. Its wording may change; do not compare it.'],
  ['details', 'When the input was refused (a 400, such as validation_failed): every problem at once, each with the field’s path and a message. Often absent otherwise.'],
  ['requestId', 'The request’s id, also sent as the X-Request-Id header. Quote it when you report a problem.'],
]

/** The anchor of the error shape's description, which each operation's error answers link to. */
export const ERRORS_ID = 'api-errors'

export function ApiIntro({ document }: { document: unknown }) {
  const info = isObject(document) && isObject(document.info) ? document.info : {}
  const cookie = sessionCookieName(document)
  return (
    <section aria-labelledby="api-intro-heading" className="flex min-w-0 flex-col gap-4 rounded-panel border border-rule bg-surface p-5">
      <h2 id="api-intro-heading" className="text-xl font-bold">
        Before you start
      </h2>
      {typeof info.title === 'string' && (
        <p>
          {info.title}
          {typeof info.version === 'string' && <>, version <code>{info.version}</code></>}.
          {typeof info.description === 'string' && <span className="block whitespace-pre-line text-ink-muted">
              <InlineText text={info.description} />
            </span>}
        </p>
      )}

      <h3 className="font-bold">Addresses and format</h3>
      <p>
        Every address begins with <code>/api</code>, on the same host as this site. Request bodies and answers are JSON (UTF-8) unless an operation says otherwise:
        files are uploaded as <code>multipart/form-data</code>, and some answers are files themselves (a PDF, a CSV).
      </p>

      <h3 className="font-bold">Signing in</h3>
      <p>
        Operations marked “Needs the session cookie” answer only to a signed-in account: signing in sets the session cookie
        {cookie && (
          <>
            {' '}
            (<code>{cookie}</code>)
          </>
        )}
        , which goes back with every later request. Each operation lists who may call it. A record of another office answers 404, as if it did not
        exist; a role that may not act answers 403.
      </p>
      <p>
        From a web browser, requests that change something (POST, PUT, PATCH, DELETE) are accepted only from this site’s own origin; one sent by a page of
        another site is refused with 403 <code>cross_site_request</code>. Programs outside a browser are not subject to this check.
      </p>

      <h3 id={ERRORS_ID} className="scroll-mt-4 font-bold">
        Errors
      </h3>
      <p>Every error answer has the same shape:</p>
      <pre className="whitespace-pre-wrap rounded-control border border-rule bg-paper p-3 text-sm [overflow-wrap:anywhere]">
        <code>{ERROR_EXAMPLE}</code>
      </pre>
      <dl className="grid gap-x-4 gap-y-2 text-sm sm:grid-cols-[max-content_1fr]">
        {ERROR_FIELDS.map(([field, words]) => (
          <Fragment key={field}>
            <dt>
              <code className="font-semibold">{field}</code>
            </dt>
            <dd>{words}</dd>
          </Fragment>
        ))}
      </dl>

      <h3 className="font-bold">The document itself</h3>
      <p>
        This page is read from the API’s OpenAPI 3.1 description, built from the same schemas the server checks requests and answers with.{' '}
        <a href={API_DOCUMENT_URL} download="quietband-openapi.json">
          Download the OpenAPI document (JSON)
        </a>
      </p>
    </section>
  )
}
