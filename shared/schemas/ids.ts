import { z } from 'zod'

/** A record's id, everywhere: a uuid (PostgreSQL's ids), checked before any query. */
export const idSchema = z.uuid({ message: 'Not a valid id.' })

/** A route's `:id` path parameter. */
export const idParamSchema = z.object({ id: idSchema })
