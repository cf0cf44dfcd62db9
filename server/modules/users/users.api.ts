/** The document's entries for people: the administrator's accounts and the staff lists (users.routes.ts). */
import { createStaffSchema } from '../../../shared/schemas/auth'
import { idParamSchema } from '../../../shared/schemas/ids'
import { personChangedResponseSchema, updatePersonSchema } from '../../../shared/schemas/people'
import { staffListResponseSchema, staffMemberResponseSchema, userResponseSchema, usersResponseSchema } from '../../../shared/schemas/views'
import { STAFF, type ApiOperation } from '../../openapi/operation'

const tag = 'People'

export const usersApi: ApiOperation[] = [
  { method: 'get', path: '/api/admin/users', summary: 'Every account', tag, callers: ['admin'], responses: { 200: usersResponseSchema } },
  {
    method: 'post',
    path: '/api/admin/users',
    summary: 'Invite a staff member or administrator',
    tag,
    callers: ['admin'],
    body: createStaffSchema,
    responses: { 201: userResponseSchema },
    errors: [409],
    description: 'E-mails a link to choose a password; 409 email_taken for an address in use. Audited.',
  },
  {
    method: 'patch',
    path: '/api/admin/users/:id',
    summary: "Change a person's role, office or whether they may sign in",
    tag,
    callers: ['admin'],
    params: idParamSchema,
    body: updatePersonSchema,
    responses: { 200: personChangedResponseSchema },
    errors: [409],
    description: "Ends the person's sessions and sends their open cases back to their old office's triage. 409 last_admin, cannot_deactivate_self. Audited.",
  },
  { method: 'get', path: '/api/staff', summary: "Staff the caller may see (their office's; an administrator: everyone's)", tag, callers: STAFF, responses: { 200: staffListResponseSchema } },
  {
    method: 'get',
    path: '/api/staff/:id',
    summary: 'One staff member',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: staffMemberResponseSchema },
    description: "Another office's staff member is 404 to staff.",
  },
]
