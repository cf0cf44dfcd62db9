import { Router } from 'express'
import { z } from 'zod'
import { createStaffSchema } from '../../../shared/schemas/auth'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { idParamSchema } from '../../../shared/schemas/ids'
import { createStaffUser, getStaffMember, listAllUsers, listStaff, setUserActive } from './users.service'

const idParam = idParamSchema
const activeBody = z.object({ active: z.boolean() })

export function usersRoutes(ctx: ServiceContext): Router {
  const r = Router()
  r.get('/admin/users', requireRole('admin'), async (req, res) => {
    res.json({ users: await listAllUsers(ctx, actorOf(req)) })
  })
  r.post('/admin/users', requireRole('admin'), async (req, res) => {
    const user = await createStaffUser(ctx, actorOf(req), parseWith(createStaffSchema, req.body))
    res.status(201).json({ user })
  })
  r.patch('/admin/users/:id', requireRole('admin'), async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    const { active } = parseWith(activeBody, req.body)
    res.json({ user: await setUserActive(ctx, actorOf(req), id, active) })
  })
  r.get('/staff', requireRole('investigator', 'supervisor', 'admin'), async (req, res) => {
    res.json({ staff: await listStaff(ctx, actorOf(req)) })
  })
  r.get('/staff/:id', requireRole('investigator', 'supervisor', 'admin'), async (req, res) => {
    const { id } = parseWith(idParam, req.params)
    res.json({ staff: await getStaffMember(ctx, actorOf(req), id) })
  })
  return r
}
