import { Router } from 'express'
import { createStaffSchema } from '../../../shared/schemas/auth'
import type { ServiceContext } from '../../context'
import { actorOf, requireRole } from '../../http/authenticate'
import { parseWith } from '../../http/validate'
import { idParamSchema } from '../../../shared/schemas/ids'
import { createStaffUser, getStaffMember, listAllUsers, listStaff } from './users.service'
import { updatePerson } from './people.service'
import { updatePersonSchema } from '../../../shared/schemas/people'

const idParam = idParamSchema

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
    res.json(await updatePerson(ctx, actorOf(req), id, parseWith(updatePersonSchema, req.body)))
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
