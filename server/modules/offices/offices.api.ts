/** The offices module's operations, for the API document (server/openapi). */
import type { ApiOperation } from '../../openapi/operation'
import { idParamSchema } from '../../../shared/schemas/ids'
import { responseTargetsSchema } from '../../../shared/schemas/auth'
import { areaCheckRequestSchema, areaCheckResponseSchema, officeInputSchema, officeSavedResponseSchema, officeTimeZoneSchema, officeUpdateSchema } from '../../../shared/schemas/offices'
import { officeResponseSchema, officesResponseSchema } from '../../../shared/schemas/views'

const tag = 'Offices'
const staff = ['investigator', 'supervisor', 'admin'] as const
const settersOfTargets = ['supervisor', 'admin'] as const

export const officesApi: ApiOperation[] = [
  { method: 'get', path: '/api/offices', tag, callers: staff, summary: 'Offices the caller may see: their own, or every office for an administrator', responses: { 200: officesResponseSchema } },
  { method: 'get', path: '/api/offices/:id', tag, callers: staff, params: idParamSchema, summary: 'One office, with its area and targets', responses: { 200: officeResponseSchema } },
  { method: 'put', path: '/api/offices/:id/response-targets', tag, callers: settersOfTargets, params: idParamSchema, body: responseTargetsSchema, summary: "Set the office's resolution targets per harm class [h]; open cases' due times follow", responses: { 200: officeResponseSchema } },
  { method: 'put', path: '/api/offices/:id/first-response-targets', tag, callers: settersOfTargets, params: idParamSchema, body: responseTargetsSchema, summary: "Set the office's first-response targets per harm class [h]", responses: { 200: officeResponseSchema } },
  { method: 'put', path: '/api/offices/:id/time-zone', tag, callers: settersOfTargets, params: idParamSchema, body: officeTimeZoneSchema, summary: "Set the office's IANA time zone", responses: { 200: officeResponseSchema } },
  {
    method: 'post',
    path: '/api/admin/offices',
    tag,
    callers: ['admin'],
    body: officeInputSchema,
    summary: 'Set up a new office with its details and area',
    description: 'The area (a GeoJSON Polygon or MultiPolygon whose edges do not cross) routes every report filed inside it to this office. Overlaps with other areas and a position outside the area are saved with warnings. 409 office_name_taken when the name is in use.',
    responses: { 201: officeSavedResponseSchema },
  },
  {
    method: 'post',
    path: '/api/admin/offices/check-area',
    tag,
    callers: ['admin'],
    body: areaCheckRequestSchema,
    summary: "An area's size [km²] and what it would overlap, before it is saved (nothing is written)",
    responses: { 200: areaCheckResponseSchema },
  },
  {
    method: 'put',
    path: '/api/admin/offices/:id',
    tag,
    callers: ['admin'],
    params: idParamSchema,
    body: officeUpdateSchema,
    summary: "Replace an office's details and area",
    description: '409 stale_version when someone saved since the version sent; 409 office_name_taken for a name in use.',
    responses: { 200: officeSavedResponseSchema },
  },
]
