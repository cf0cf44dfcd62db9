/**
 * Free text as the API accepts it. Two kinds of character cannot be stored: PostgreSQL text
 * cannot hold U+0000, and a lone UTF-16 surrogate (half of a broken emoji, say) cannot be
 * written into the jsonb of a queued e-mail. A string carrying either is refused at the door
 * with a field error instead of failing in the database.
 */
import { z } from 'zod'

export const NUL_MESSAGE = 'Remove the invisible control character (U+0000) from this text.'
export const LONE_SURROGATE_MESSAGE = 'This text holds a broken character (half of an emoji or symbol). Retype it.'

/** A high surrogate not followed by a low one, or a low surrogate not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/

/** A string that can be stored; chain .trim(), .min(), .max() as on z.string(). */
export const storableString = () =>
  z
    .string()
    .refine((s) => !s.includes('\u0000'), { message: NUL_MESSAGE })
    .refine((s) => !LONE_SURROGATE.test(s), { message: LONE_SURROGATE_MESSAGE })
