import { useState } from 'react'
import { useSearchParams } from 'react-router-dom'

/** Shortest token an e-mailed link can carry (the server issues 43 characters; it refuses under 20). */
const MIN_TOKEN_LENGTH = 20

/**
 * The `?token=` of an e-mailed link (confirmation, password, invitation): usable until the
 * server has refused it once, after which the page offers a new link instead of the form.
 */
export function useEmailedToken(): { token: string; usable: boolean; refuse(): void } {
  const [params] = useSearchParams()
  const token = params.get('token') ?? ''
  const [refused, setRefused] = useState(false)
  return { token, usable: token.length >= MIN_TOKEN_LENGTH && !refused, refuse: () => setRefused(true) }
}
