/** An office's equipment register, as the API document describes it (routes: equipment.routes.ts). */
import { idParamSchema } from '../../../shared/schemas/ids'
import { equipmentHistoryResponseSchema, equipmentListResponseSchema, equipmentPatchSchema, equipmentResponseSchema, newEquipmentSchema } from '../../../shared/schemas/measurements'
import { STAFF, type ApiOperation } from '../../openapi/operation'

const tag = 'Equipment'

export const equipmentApi: ApiOperation[] = [
  {
    method: 'get',
    path: '/api/offices/:id/equipment',
    summary: 'An office\'s antennas and instruments, with each one\'s calibration state',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: equipmentListResponseSchema },
  },
  {
    method: 'post',
    path: '/api/offices/:id/equipment',
    summary: 'Add an antenna or instrument to an office\'s register',
    tag,
    callers: ['supervisor', 'admin'],
    params: idParamSchema,
    body: newEquipmentSchema,
    responses: { 201: equipmentResponseSchema },
    description: 'The office\'s supervisor or an administrator.',
  },
  {
    method: 'patch',
    path: '/api/equipment/:id',
    summary: 'Revise an item of the equipment register, on the version last read',
    tag,
    callers: ['supervisor', 'admin'],
    params: idParamSchema,
    body: equipmentPatchSchema,
    responses: { 200: equipmentResponseSchema },
    errors: [409],
    description: 'A stale version is refused (409 stale_version); the fields before and after join the item\'s history.',
  },
  {
    method: 'get',
    path: '/api/equipment/:id/history',
    summary: 'An equipment item\'s changes, each with its author and the fields before and after',
    tag,
    callers: STAFF,
    params: idParamSchema,
    responses: { 200: equipmentHistoryResponseSchema },
  },
]
