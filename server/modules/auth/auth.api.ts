/** The document's entries for sign-in and accounts (auth.routes.ts). */
import {
  accountRequestResponseSchema,
  confirmEmailSchema,
  meResponseSchema,
  registerSchema,
  resetRequestSchema,
  setPasswordSchema,
  signedInSchema,
  signInSchema,
} from '../../../shared/schemas/auth'
import { EVERYONE, type ApiOperation } from '../../openapi/operation'

const tag = 'Sign-in and accounts'

export const authApi: ApiOperation[] = [
  {
    method: 'post',
    path: '/api/auth/sign-in',
    summary: 'Sign in with e-mail and password',
    tag,
    callers: EVERYONE,
    body: signInSchema,
    responses: { 200: signedInSchema },
    errors: [401, 403],
    description: 'Starts a session (cookie qb.sid). 401 invalid_credentials whether or not the account exists; 403 email_not_confirmed. Answers slow down after repeated failures for one address.',
  },
  { method: 'post', path: '/api/auth/sign-out', summary: 'End the session', tag, callers: EVERYONE, responses: { 204: { description: 'Signed out (also when no one was signed in).' } } },
  {
    method: 'get',
    path: '/api/me',
    summary: 'The signed-in person and what the account may do',
    tag,
    callers: EVERYONE,
    responses: { 200: meResponseSchema },
    description: 'An anonymous visitor gets `{ user: null }`, not an error.',
  },
  {
    method: 'post',
    path: '/api/auth/register',
    summary: 'Create a complainant account',
    tag,
    callers: EVERYONE,
    body: registerSchema,
    responses: { 202: accountRequestResponseSchema },
    errors: [429],
    description: 'The same answer whether or not the address has an account; the e-mail tells the rest.',
  },
  { method: 'post', path: '/api/auth/confirm-email', summary: 'Confirm an e-mail address from its link, and sign in', tag, callers: EVERYONE, body: confirmEmailSchema, responses: { 200: signedInSchema }, errors: [429] },
  {
    method: 'post',
    path: '/api/auth/password-reset',
    summary: 'Ask for a link to choose a password',
    tag,
    callers: EVERYONE,
    body: resetRequestSchema,
    responses: { 202: accountRequestResponseSchema },
    errors: [429],
    description: 'The same answer whether or not the address has an account.',
  },
  { method: 'post', path: '/api/auth/set-password', summary: 'Choose a password from an e-mailed link, and sign in', tag, callers: EVERYONE, body: setPasswordSchema, responses: { 200: signedInSchema }, errors: [429] },
]
